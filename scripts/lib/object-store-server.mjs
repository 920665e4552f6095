// The local S3-compatible object store for demo, test and bench runs (started by scripts/lib/object-store.sh):
// @20minutes/s3rver, a maintained fork of s3rver, on 127.0.0.1 with its files in a data folder of its own.
// It checks every request's AWS signature against the one key pair given here (its built-in S3RVER pair is
// dropped), so the store is no more open than a real provider's bucket.
//
// Usage: node object-store-server.mjs PORT DATA_DIR BUCKET
// Environment: KB_S3_ACCESS_KEY_ID, KB_S3_SECRET_ACCESS_KEY (the keys the app signs with).
import { createRequire } from "node:module";

const require = createRequire(import.meta.url);
const S3rver = require("@20minutes/s3rver");
const { DUMMY_ACCOUNT } = require("@20minutes/s3rver/lib/models/account");

const [portArg, directory, bucket] = process.argv.slice(2);
const port = Number(portArg);
const accessKeyId = process.env.KB_S3_ACCESS_KEY_ID;
const secretAccessKey = process.env.KB_S3_SECRET_ACCESS_KEY;
if (!Number.isInteger(port) || !directory || !bucket || !accessKeyId || !secretAccessKey) {
  console.error("usage: KB_S3_ACCESS_KEY_ID=… KB_S3_SECRET_ACCESS_KEY=… node object-store-server.mjs PORT DATA_DIR BUCKET");
  process.exit(2);
}

// Only our key pair signs requests: the package's well-known one is revoked.
DUMMY_ACCOUNT.revokeAccessKey("S3RVER");
DUMMY_ACCOUNT.createKeyPair(accessKeyId, secretAccessKey);

const server = new S3rver({ address: "127.0.0.1", port, directory, silent: true, configureBuckets: [{ name: bucket }] });
await server.run();
console.log(`object store: listening on http://127.0.0.1:${port}, bucket ${bucket}, data in ${directory}`);

let closing = false;
const stop = async () => {
  if (closing) return;
  closing = true;
  // Ends open connections too: a stop never waits for an idle keep-alive socket to time out.
  server.httpServer?.closeAllConnections?.();
  await server.close().catch(() => {});
  process.exit(0);
};
for (const signal of ["SIGTERM", "SIGINT", "SIGHUP"]) process.on(signal, stop);
