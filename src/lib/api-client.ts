// A small typed fetch for our JSON API: errors become ApiError with the server's code and field issues.

export type FieldIssue = { path: string; message: string };

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldIssue[] = [],
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init: { method?: string; body?: unknown; signal?: AbortSignal } = {}): Promise<T> {
  return answerOf<T>(
    await send(path, {
      method: init.method ?? "GET",
      headers: init.body !== undefined ? { "content-type": "application/json" } : undefined,
      body: init.body !== undefined ? JSON.stringify(init.body) : undefined,
      signal: init.signal,
    }),
  );
}

/**
 * Sends a file's bytes to an upload route (application/octet-stream, its name percent-encoded in X-File-Name;
 * extra headers as given). The server sniffs the real type; errors become ApiError like any other call.
 */
export async function uploadFile<T>(path: string, file: Blob & { name?: string }, init: { method?: string; headers?: Record<string, string>; signal?: AbortSignal } = {}): Promise<T> {
  return answerOf<T>(
    await send(path, {
      method: init.method ?? "POST",
      headers: { "content-type": "application/octet-stream", ...(file.name ? { "x-file-name": encodeURIComponent(file.name) } : {}), ...init.headers },
      body: file,
      signal: init.signal,
    }),
  );
}

async function send(path: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(path, { ...init, credentials: "same-origin" });
  } catch (error) {
    if ((error as Error).name === "AbortError") throw error;
    throw new ApiError(0, "network", "Could not reach the server. Check your connection and try again.");
  }
}

/** The JSON answer of a call, or its error as ApiError (204: nothing). */
async function answerOf<T>(res: Response): Promise<T> {
  if (res.status === 204) return undefined as T;
  const data = (await res.json().catch(() => null)) as { error?: { code: string; message: string; fields?: FieldIssue[] } } | null;
  if (!res.ok) {
    const e = data?.error;
    throw new ApiError(res.status, e?.code ?? "http_error", e?.message ?? `The server answered ${res.status}.`, e?.fields ?? [], (e ?? {}) as Record<string, unknown>);
  }
  return data as T;
}
