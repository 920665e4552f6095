// Calls the real route handlers with a Request, as Next would, against the test database.
import { randomUUID } from "node:crypto";
import { POST as authPost } from "@/app/api/auth/[...all]/route";

export const BASE = process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:3000";

type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;

/** `omitOrigin` sends a write without the Origin header a browser would add (every write gets the app's by default). */
export type CallOptions = { cookie?: string; body?: unknown; rawBody?: string; headers?: Record<string, string>; omitOrigin?: boolean };

export async function call<P>(handler: Handler<P>, method: string, path: string, params: P, opts: CallOptions = {}) {
  const headers: Record<string, string> = { ...opts.headers };
  // A browser sends Origin on every request but GET and HEAD; the write routes refuse a cookie without it.
  if (method !== "GET" && method !== "HEAD" && !opts.omitOrigin && !Object.keys(headers).some((h) => h.toLowerCase() === "origin")) {
    headers.origin = new URL(BASE).origin;
  }
  if (opts.cookie) headers.cookie = opts.cookie;
  let body: string | undefined;
  if (opts.rawBody !== undefined) body = opts.rawBody;
  else if (opts.body !== undefined) body = JSON.stringify(opts.body);
  if (body !== undefined && !Object.keys(headers).some((h) => h.toLowerCase() === "content-type")) headers["content-type"] = "application/json";
  const res = await handler(new Request(`${BASE}${path}`, { method, headers, body }), { params: Promise.resolve(params) });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return { status: res.status, json: json as any, headers: res.headers };
}

/** A GET of a file: the answer's bytes as they are (a PDF is not text), and as text for the rest. */
export async function download<P>(handler: Handler<P>, path: string, params: P, cookie?: string) {
  const res = await handler(new Request(`${BASE}${path}`, { headers: cookie ? { cookie } : {} }), { params: Promise.resolve(params) });
  const bytes = Buffer.from(await res.arrayBuffer());
  const text = bytes.toString("utf8");
  let json: unknown = null;
  if ((res.headers.get("content-type") ?? "").startsWith("application/json")) json = JSON.parse(text);
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return { status: res.status, headers: res.headers, bytes, text, json: json as any };
}

function cookieFrom(res: Response): string {
  const set = res.headers.getSetCookie();
  return set.map((c) => c.split(";")[0]).join("; ");
}

export function randomClientIp(): string {
  const b = () => Math.floor(Math.random() * 254) + 1;
  return `198.18.${b()}.${b()}`;
}

/**
 * Headers as scripts/serve.mjs hands a request from `ip` to the app: the connection's peer address in the
 * header KB_SOCKET_ADDRESS_HEADER names (set for the integration tests in tests/vitest.config.ts).
 */
export function fromAddress(ip: string): Record<string, string> {
  return { "x-kb-socket-address": ip };
}

export function uniqueEmail(tag: string): string {
  return `${tag}-${randomUUID().slice(0, 8)}@test.example`;
}

/** Signs up through better-auth's own handler and returns the session cookie. */
export async function signUp(name: string, email = uniqueEmail(name.toLowerCase().replace(/\W+/g, "")), password = "correct-horse-9") {
  const res = await authPost(
    new Request(`${BASE}/api/auth/sign-up/email`, {
      method: "POST",
      // A distinct client address per sign-up, so the auth rate limit (on in these tests) never pools them.
      headers: { "content-type": "application/json", origin: new URL(BASE).origin, ...fromAddress(randomClientIp()) },
      body: JSON.stringify({ name, email, password }),
    }),
  );
  if (res.status !== 200) throw new Error(`sign-up failed: ${res.status} ${await res.text()}`);
  const data = (await res.json()) as { user: { id: string } };
  return { cookie: cookieFrom(res), userId: data.user.id, email, password };
}

export async function signIn(email: string, password: string, headers: Record<string, string> = {}) {
  return authPost(
    new Request(`${BASE}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: new URL(BASE).origin, ...fromAddress(randomClientIp()), ...headers },
      body: JSON.stringify({ email, password }),
    }),
  );
}
