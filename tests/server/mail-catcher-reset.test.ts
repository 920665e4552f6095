// The local mail catcher outlives a client that resets its connection mid-session (a crash here once lost
// every later message of a test run): after the reset its API still answers and a message still lands.
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { connect } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, expect, it } from "vitest";
import { freePort } from "../helpers/ports";

let catcher: ChildProcess;
let dir: string;
let smtpPort = 0;
let apiPort = 0;
const USER = "kbreset";
const PASSWORD = "reset-test-password-000000";

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "kb-mail-reset-"));
  smtpPort = await freePort();
  apiPort = await freePort();
  catcher = spawn(process.execPath, ["scripts/lib/mail-catcher-server.mjs", String(smtpPort), String(apiPort), dir], {
    env: { ...process.env, KB_SMTP_USER: USER, KB_SMTP_PASSWORD: PASSWORD },
    stdio: ["ignore", "pipe", "pipe"],
  });
  for (let i = 0; i < 100; i++) {
    if (await fetch(`http://127.0.0.1:${apiPort}/`).then(() => true, () => false)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error("the mail catcher did not start");
});

afterAll(() => {
  catcher?.kill("SIGKILL");
  rmSync(dir, { recursive: true, force: true });
});

it("keeps serving after a client resets its SMTP connection", async () => {
  // Signed in and inside a transaction (after MAIL FROM): the reset smtp-server reports as an error.
  await new Promise<void>((resolve, reject) => {
    const socket = connect(smtpPort, "127.0.0.1");
    const auth = Buffer.from(`\0${USER}\0${PASSWORD}`).toString("base64");
    const steps = ["EHLO reset.test", `AUTH PLAIN ${auth}`, "MAIL FROM:<reset@knucklebench.test>"];
    let replies = "";
    socket.once("error", reject);
    socket.on("data", (chunk) => {
      replies += chunk.toString();
      // Each reply's last line is "NNN text" (no dash after the code).
      if (!/^\d{3} .*\r\n$/m.test(replies.split(/\r\n(?=\d{3}[ -])/).at(-1) ?? "")) return;
      replies = "";
      const next = steps.shift();
      if (next) socket.write(`${next}\r\n`);
      else {
        socket.resetAndDestroy();
        resolve();
      }
    });
  });
  await new Promise((r) => setTimeout(r, 300));
  expect(catcher.exitCode, "the catcher is still running").toBeNull();
  const api = await fetch(`http://127.0.0.1:${apiPort}/`);
  expect(api.status).toBeLessThan(500);

  const transport = nodemailer.createTransport({ host: "127.0.0.1", port: smtpPort, secure: false, auth: { user: USER, pass: PASSWORD }, tls: { rejectUnauthorized: false } });
  const sent = await transport.sendMail({ from: "bench@knucklebench.test", to: "after-reset@knucklebench.test", subject: "After the reset", text: "still here" });
  expect(sent.accepted).toEqual(["after-reset@knucklebench.test"]);
});
