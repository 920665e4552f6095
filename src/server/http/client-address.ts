import "server-only";
import type { IncomingMessage } from "node:http";
import proxyAddr from "proxy-addr";
import { env } from "../env";

/** The header better-auth reads the client address from (auth.ts); only withClientAddress sets it. */
export const CLIENT_ADDRESS_HEADER = "x-kb-client-address";

type Trust = (addr: string, hop: number) => boolean;

function trustFromEnv(): Trust {
  const list = env.KB_TRUSTED_PROXIES.split(",").map((s) => s.trim()).filter(Boolean);
  if (list.length > 0) return proxyAddr.compile(list);
  const hops = env.KB_TRUST_PROXY_HOPS;
  return (_addr, hop) => hop < hops;
}

const trust = trustFromEnv();

/**
 * The address a request is counted against: the connection's peer address (recorded by scripts/serve.mjs,
 * since route handlers cannot see the socket), or — only through proxies KB_TRUST_PROXY_HOPS /
 * KB_TRUSTED_PROXIES trust — the X-Forwarded-For entry the nearest untrusted hop added. Null when the
 * server in front did not record a peer address.
 */
export function clientAddress(headers: Headers): string | null {
  const header = env.KB_SOCKET_ADDRESS_HEADER;
  const peer = header ? headers.get(header)?.trim() : undefined;
  if (!peer) return null;
  // proxy-addr reads the shape of a Node request: the socket address and the forwarded chain.
  const view = { headers: { "x-forwarded-for": headers.get("x-forwarded-for") ?? "" }, socket: { remoteAddress: peer } };
  return proxyAddr(view as unknown as IncomingMessage, trust);
}

/** The request with CLIENT_ADDRESS_HEADER set to clientAddress (or removed), whatever the client sent. */
export function withClientAddress(req: Request): Request {
  const headers = new Headers(req.headers);
  headers.delete(CLIENT_ADDRESS_HEADER);
  const address = clientAddress(req.headers);
  if (address) headers.set(CLIENT_ADDRESS_HEADER, address);
  return new Request(req, { headers });
}
