// Waits until a URL answers with any HTTP status (the app is up), or fails when the server process
// exits or the timeout passes. Usage: node wait-http.mjs URL TIMEOUT_SECONDS [PID]
const [url, timeoutArg = "60", pidArg] = process.argv.slice(2);
const deadline = Date.now() + Number(timeoutArg) * 1000;
const pid = pidArg ? Number(pidArg) : undefined;

function alive(p) {
  try {
    process.kill(p, 0);
    return true;
  } catch {
    return false;
  }
}

while (Date.now() < deadline) {
  if (pid !== undefined && !alive(pid)) {
    console.error(`the server process exited before ${url} answered`);
    process.exit(1);
  }
  try {
    await fetch(url, { redirect: "manual", signal: AbortSignal.timeout(5000) });
    process.exit(0);
  } catch {
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
}
console.error(`${url} did not answer within ${timeoutArg} s`);
process.exit(1);
