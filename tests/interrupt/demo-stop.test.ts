// `npm run demo` in a terminal, stopped the ways a person stops it: Ctrl-C (which reaches npm and the demo
// script at once), Ctrl-C pressed again while it stops, SIGTERM to its process group, the terminal closed.
// Each time the app, the design-search workers, the mail catcher, the object store and then PostgreSQL must stop before the prompt returns, and a kit and a
// file written in the first run must still be there in the next. A demo of its own beside any other (ports, cluster), serving the
// build `npm test` made (KB_DEMO_BUILD=reuse).
import { rmSync } from "node:fs";
import { join } from "node:path";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { freePort } from "../helpers/ports";
import { endLeftovers, expectNothingLeft, mailCatcherOn, objectStoreOn, searchWorkers, snapshot, type Started, STOP_ORDER } from "./helpers/stopping";
import { openTerminal, repoRoot, type Terminal } from "./helpers/terminal";

const CLUSTER = "pg-interrupt-demo";
const STORE = "s3-interrupt-demo";
const MAILBOX = "mail-interrupt-demo";
const KIT_NAME = `Interrupt check ${Date.now()}`;
const START_MS = 180_000;
const STOP_MS = 90_000;

let appPort: number;
let pgPort: number;
let s3Port: number;
let mailPort: number;
let term: Terminal | undefined;
let started: Started | undefined;
const dataDirs = new Set<string>();

beforeAll(async () => {
  appPort = await freePort();
  pgPort = await freePort();
  s3Port = await freePort();
  mailPort = await freePort(); // its API on the next port
  rmSync(join(repoRoot, ".data", CLUSTER), { recursive: true, force: true });
  for (const f of [STORE, `${STORE}.keys`, MAILBOX, `${MAILBOX}.keys`]) rmSync(join(repoRoot, ".data", f), { recursive: true, force: true });
});

// Only does anything when a test failed half-way.
afterEach(async () => {
  await endLeftovers(term, pgPort, started, s3Port, mailPort);
  term = started = undefined;
});

afterAll(() => {
  for (const dir of dataDirs) rmSync(dir, { recursive: true, force: true });
  rmSync(join(repoRoot, ".data", `${CLUSTER}.password`), { force: true });
  for (const f of [STORE, `${STORE}.keys`, `${STORE}.log`, MAILBOX, `${MAILBOX}.keys`, `${MAILBOX}.log`]) rmSync(join(repoRoot, ".data", f), { recursive: true, force: true });
});

const base = () => `http://127.0.0.1:${appPort}`;

async function startDemo(): Promise<{ term: Terminal; started: Started }> {
  term = openTerminal("exec npm run demo", {
    KB_DEMO_PORT: String(appPort),
    KB_DEMO_PG_PORT: String(pgPort),
    KB_DEMO_PG_NAME: CLUSTER,
    KB_DEMO_S3_PORT: String(s3Port),
    KB_DEMO_S3_NAME: STORE,
    KB_DEMO_MAIL_PORT: String(mailPort),
    KB_DEMO_MAIL_NAME: MAILBOX,
    KB_DEMO_BUILD: "reuse",
  });
  await term.waitFor(/Press Ctrl-C to stop the app, the mail catcher, the object store and the database/, START_MS);
  const health = await fetch(`${base()}/api/health`);
  expect(health.status).toBe(200);
  started = snapshot(term, pgPort);
  expect(started.processes.some((p) => p.args.includes("scripts/serve.mjs")), "the app runs under the terminal").toBe(true);
  expect(objectStoreOn(s3Port, started.processes).length, "the object store runs under the terminal").toBe(1);
  expect(mailCatcherOn(mailPort, started.processes).length, "the mail catcher runs under the terminal").toBe(1);
  expect(searchWorkers(started.processes).length, "a design-search worker runs under the terminal").toBeGreaterThanOrEqual(1);
  dataDirs.add(started.pgDataDir);
  return { term, started };
}

/** Signs in as the demo's owner with what the demo printed, and returns the cookie and the demo workspace. */
async function signInAsPrinted(output: string): Promise<{ cookie: string; workspaceId: string }> {
  const password = /password for all: (\S+)\)/.exec(output)?.[1];
  const email = /owner\s+(\S+@\S+)/.exec(output)?.[1];
  expect(password && email, "the demo prints how to sign in").toBeTruthy();
  const res = await fetch(`${base()}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base() },
    body: JSON.stringify({ email, password }),
  });
  expect(res.status).toBe(200);
  const cookie = res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const list = (await (await fetch(`${base()}/api/workspaces`, { headers: { cookie } })).json()) as { workspaces: { id: string; name: string }[] };
  const workspace = list.workspaces.find((w) => w.name === "Harrow Flats RC Works");
  expect(workspace, "the demo workspace").toBeDefined();
  return { cookie, workspaceId: workspace!.id };
}

async function kitNames(output: string): Promise<string[]> {
  const { cookie, workspaceId } = await signInAsPrinted(output);
  const res = await fetch(`${base()}/api/workspaces/${workspaceId}/kits`, { headers: { cookie } });
  expect(res.status).toBe(200);
  return ((await res.json()) as { kits: { name: string }[] }).kits.map((k) => k.name);
}

// A small PNG (1 × 1, one grey pixel) put under the check kit's top view in the first run.
const PIXEL_PNG = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAAAAAA6fptVAAAACklEQVR4nGNoAAAAggCBd81ytgAAAABJRU5ErkJggg==", "base64");

/** The bytes of the file under the check kit's top view, as a member downloads them. */
async function underlayBytes(output: string): Promise<Buffer> {
  const { cookie, workspaceId } = await signInAsPrinted(output);
  const list = (await (await fetch(`${base()}/api/workspaces/${workspaceId}/kits`, { headers: { cookie } })).json()) as { kits: { id: string; name: string }[] };
  const kit = list.kits.find((k) => k.name === KIT_NAME)!;
  const underlays = (await (await fetch(`${base()}/api/workspaces/${workspaceId}/kits/${kit.id}/underlays`, { headers: { cookie } })).json()) as { underlays: { file: { url: string } }[] };
  expect(underlays.underlays).toHaveLength(1);
  const file = await fetch(`${base()}${underlays.underlays[0]!.file.url}`, { headers: { cookie } });
  expect(file.status).toBe(200);
  return Buffer.from(await file.arrayBuffer());
}

describe("npm run demo stops the app and then the database", () => {
  it("on Ctrl-C, keeping what was written", async () => {
    const { term, started } = await startDemo();
    const { cookie, workspaceId } = await signInAsPrinted(term.output());
    const created = await fetch(`${base()}/api/workspaces/${workspaceId}/kits`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: base(), cookie },
      body: JSON.stringify({ name: KIT_NAME, scale: "1:10" }),
    });
    expect(created.status).toBe(201);
    const kitId = ((await created.json()) as { kit: { id: string } }).kit.id;
    const put = await fetch(`${base()}/api/workspaces/${workspaceId}/kits/${kitId}/underlays/top`, {
      method: "PUT",
      headers: { "content-type": "application/octet-stream", "x-file-name": "pixel.png", origin: base(), cookie },
      body: PIXEL_PNG,
    });
    expect(put.status).toBe(201);

    term.interrupt();
    expect(await term.exited(STOP_MS)).toBe(0); // stopping on Ctrl-C is how the demo ends
    await expectNothingLeft(started, [appPort, mailPort, mailPort + 1, s3Port, pgPort]);
    expect(term.output()).toMatch(STOP_ORDER);
  });

  it("on Ctrl-C pressed again and again while it stops; the kit and the file of the first run are still there", async () => {
    const { term, started } = await startDemo();
    expect(await kitNames(term.output())).toContain(KIT_NAME);
    expect((await underlayBytes(term.output())).equals(PIXEL_PNG)).toBe(true);

    const from = term.output().length;
    term.interrupt();
    await term.waitFor(/stopping the app/, STOP_MS, from);
    term.interrupt();
    await term.waitFor(/stopping PostgreSQL/, STOP_MS, from);
    term.interrupt();
    expect(await term.exited(STOP_MS)).toBe(0);
    await expectNothingLeft(started, [appPort, mailPort, mailPort + 1, s3Port, pgPort]);
  });

  it("on SIGTERM to its process group", async () => {
    const { term, started } = await startDemo();
    expect(await kitNames(term.output())).toContain(KIT_NAME);

    term.signalForeground("SIGTERM");
    expect(await term.exited(STOP_MS)).toBe(0);
    await expectNothingLeft(started, [appPort, mailPort, mailPort + 1, s3Port, pgPort]);
    expect(term.output()).toMatch(STOP_ORDER);
  });

  it("when its terminal is closed", async () => {
    const { term, started } = await startDemo();
    expect(await kitNames(term.output())).toContain(KIT_NAME);

    term.hangUp();
    await term.exited(STOP_MS);
    // No prompt comes back to wait for: the script stops on its own, within the time a stop takes.
    await expectNothingLeft(started, [appPort, mailPort, mailPort + 1, s3Port, pgPort], 30_000);
  });
});
