// Route handlers cannot see the connection: scripts/serve.mjs records each connection's peer address in a
// header of its own, replacing any copy a client sent. The app reads it through KB_SOCKET_ADDRESS_HEADER.
export const SOCKET_ADDRESS_HEADER = "x-kb-socket-address";

/** Overwrites whatever the client sent under SOCKET_ADDRESS_HEADER with the socket's peer address. */
export function stampSocketAddress(req) {
  delete req.headers[SOCKET_ADDRESS_HEADER];
  const peer = req.socket.remoteAddress;
  if (peer) req.headers[SOCKET_ADDRESS_HEADER] = peer;
}
