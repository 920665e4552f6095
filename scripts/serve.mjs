// The production server (`npm start`; demo, e2e tests and bench start it too): Next's own request handler
// behind node:http, stamping each request with its connection's peer address (scripts/lib/socket-address.mjs)
// so the auth rate limit can key on it. Usage: node scripts/serve.mjs [-H host] [-p port]
import { createServer } from "node:http";
import { parseArgs } from "node:util";
import next from "next";
import { SOCKET_ADDRESS_HEADER, stampSocketAddress } from "./lib/socket-address.mjs";

const { values } = parseArgs({
  options: {
    hostname: { type: "string", short: "H", default: "127.0.0.1" },
    port: { type: "string", short: "p", default: process.env.PORT ?? "3000" },
  },
});
const port = Number(values.port);
process.env.NODE_ENV ??= "production";
// Tells the app (src/server/env.ts) which header carries the peer address; read when the app loads.
process.env.KB_SOCKET_ADDRESS_HEADER = SOCKET_ADDRESS_HEADER;

const app = next({ dev: false, hostname: values.hostname, port });
await app.prepare();
const handle = app.getRequestHandler();
const server = createServer((req, res) => {
  stampSocketAddress(req);
  void handle(req, res);
});
server.listen(port, values.hostname, () => console.log(`> Knucklebench on http://${values.hostname}:${port}`));
// Finish the requests in flight, then exit; idle keep-alive connections would hold close() for their whole
// timeout, so they are closed at once.
const stop = () => {
  server.close(() => process.exit(0));
  server.closeIdleConnections();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
