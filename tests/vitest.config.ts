import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL("..", import.meta.url));
const alias = { "@": `${root}src`, "server-only": `${root}tests/helpers/server-only-stub.ts` };
// fmin's ES module imports its own files without extensions (bundlers and tsx resolve them, Node does not):
// vite transforms it rather than handing it to Node.
const server = { deps: { inline: ["fmin"] } };

// Three projects: pure logic (node), components (jsdom + canvas mock), and integration tests that need
// the throwaway PostgreSQL started by scripts/test.sh (DATABASE_URL set).
export default defineConfig({
  root,
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Property tests run hundreds of analyses: room for a machine busy with other work.
        test: { name: "unit", environment: "node", server, include: ["tests/engine/**/*.test.ts", "tests/contracts/**/*.test.ts", "tests/lib/**/*.test.ts", "tests/figures/**/*.test.ts", "tests/drawing/**/*.test.ts"], testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: {
          name: "component",
          environment: "jsdom",
          include: ["tests/editor/**/*.test.{ts,tsx}", "tests/components/**/*.test.{ts,tsx}"],
          setupFiles: ["tests/helpers/component-setup.ts"],
        },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          environment: "node",
          server,
          include: ["tests/api/**/*.test.ts", "tests/server/**/*.test.ts"],
          fileParallelism: false,
          // Production keeps the auth rate limit on; so do these tests (and one of them checks it). The
          // requests carry their peer address as scripts/serve.mjs would stamp it (tests/helpers/api.ts).
          // The analysis routes run their layouts in a worker thread here too (TypeScript loaded by tsx).
          env: { KB_AUTH_RATE_LIMIT: "on", KB_SOCKET_ADDRESS_HEADER: "x-kb-socket-address", KB_ANALYSIS_WORKERS: "1", KB_ANALYSIS_WORKER_TSX: "1" },
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
