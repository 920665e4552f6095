import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL("../..", import.meta.url));

// Interrupt tests: `npm run demo`, `npm test` and `npm run bench` started in a pseudo-terminal and stopped
// by a signal. One at a time (each starts PostgreSQL and the app), after scripts/test.sh built the app.
export default defineConfig({
  root,
  test: {
    name: "interrupt",
    environment: "node",
    include: ["tests/interrupt/**/*.test.ts"],
    fileParallelism: false,
    testTimeout: 300_000,
    hookTimeout: 60_000,
  },
});
