// Seeds the invented demo scenario (idempotent) and prints how to sign in.
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_WORKSPACE, seedDemo } from "@/server/data/demo-seed";

// The seed's few analyses run on this thread: the worker pool's entry is bundled only in the app's build.
process.env.KB_ANALYSIS_WORKERS ??= "0";

try {
  const { created } = await seedDemo();
  console.log(`seed: workspace "${DEMO_WORKSPACE.name}" ready (${created} kit(s) added)`);
  console.log("seed: demo sign-in (password for all: " + DEMO_PASSWORD + ")");
  for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(7)} ${p.email}`);
  process.exit(0);
} catch (error) {
  console.error("seed: failed:", error instanceof Error ? error.message : error);
  process.exit(1);
}
