// A node:http server in front of the real auth route handler, stamping each request exactly as
// scripts/serve.mjs does for Next, so a test can send requests over a real socket from 127.0.0.1.
import { createServer, type IncomingMessage, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { stampSocketAddress } from "../../scripts/lib/socket-address.mjs";
import { BASE } from "./api";

async function toRequest(req: IncomingMessage): Promise<Request> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  const headers = new Headers();
  for (const [name, value] of Object.entries(req.headers)) {
    if (value !== undefined) headers.set(name, Array.isArray(value) ? value.join(", ") : value);
  }
  return new Request(new URL(req.url ?? "/", BASE), { method: req.method, headers, body: chunks.length ? Buffer.concat(chunks) : undefined });
}

export async function startStampingServer(): Promise<{ url: string; close: () => Promise<void> }> {
  const server: Server = createServer((req, res) => {
    stampSocketAddress(req);
    void toRequest(req)
      .then((r) => authPost(r))
      .then(async (answer) => {
        res.writeHead(answer.status, Object.fromEntries(answer.headers));
        res.end(Buffer.from(await answer.arrayBuffer()));
      })
      .catch((error: unknown) => {
        res.writeHead(599);
        res.end(String(error));
      });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return { url: `http://127.0.0.1:${port}`, close: () => new Promise((resolve) => server.close(() => resolve())) };
}

/** A sign-in through the stamping server, over loopback, with whatever extra headers a client chooses. */
export function signInOver(url: string, email: string, password: string, headers: Record<string, string>) {
  return fetch(`${url}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: new URL(BASE).origin, ...headers },
    body: JSON.stringify({ email, password }),
  });
}
