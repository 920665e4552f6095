import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL("../..", import.meta.url));

// Browser tests: one Chromium at a time against the production server scripts/test.sh started
// (E2E_BASE_URL). Serial, with timeouts sized for a cold 2-core machine.
export default defineConfig({
  root,
  resolve: { alias: { "@": `${root}src` } },
  test: {
    name: "browser",
    environment: "node",
    include: ["tests/e2e/**/*.test.ts"],
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
