// Fetches one export and hands it to the browser as a download, reporting progress: nothing known while
// the server makes the file, then the share of its bytes received.
import { ApiError } from "@/lib/api-client";

export type ExportProgress = { readonly phase: "making" } | { readonly phase: "receiving"; readonly fraction: number | null };

/** The file name the server gives (Content-Disposition), else the fallback. */
export function fileNameOf(disposition: string | null, fallback: string): string {
  const m = disposition?.match(/filename="([^"]+)"/);
  return m?.[1] ?? fallback;
}

async function errorOf(res: Response): Promise<ApiError> {
  const data = (await res.json().catch(() => null)) as { error?: { code: string; message: string } } | null;
  return new ApiError(res.status, data?.error?.code ?? "http_error", data?.error?.message ?? `The server answered ${res.status}.`);
}

/** Fetches `url`, reports progress, and saves the answer under the server's file name; answers that name. */
export async function downloadExport(url: string, fallbackName: string, onProgress: (p: ExportProgress) => void, signal: AbortSignal): Promise<string> {
  onProgress({ phase: "making" });
  let res: Response;
  try {
    res = await fetch(url, { credentials: "same-origin", signal });
  } catch (error) {
    if ((error as Error).name === "AbortError") throw error;
    throw new ApiError(0, "network", "Could not reach the server. Check your connection and try again.");
  }
  if (!res.ok) throw await errorOf(res);
  const total = Number(res.headers.get("content-length")) || null;
  const chunks: Uint8Array<ArrayBuffer>[] = [];
  let received = 0;
  const reader = res.body?.getReader();
  if (reader) {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      chunks.push(value);
      received += value.byteLength;
      onProgress({ phase: "receiving", fraction: total ? Math.min(1, received / total) : null });
    }
  }
  const name = fileNameOf(res.headers.get("content-disposition"), fallbackName);
  const blob = new Blob(chunks, { type: res.headers.get("content-type") ?? "application/octet-stream" });
  const href = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Let the browser take the file before the address is freed.
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
  return name;
}
