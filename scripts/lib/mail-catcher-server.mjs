// The local SMTP catcher for demo, test and bench runs (started by scripts/lib/mail-catcher.sh): nodemailer's
// own smtp-server receives what the app sends, mailparser reads each message, and every message is kept as a
// JSON file in a data folder of its own. A small HTTP API beside it lets the app's mail page and the tests
// read the real messages. Both listen on 127.0.0.1 only; SMTP asks for the user and password given here (as
// a real provider does), the API for the same password as a bearer token.
//
// Usage: node mail-catcher-server.mjs SMTP_PORT API_PORT DATA_DIR
// Environment: KB_SMTP_USER, KB_SMTP_PASSWORD.
//
// API: GET /messages[?to=ADDRESS] → { messages: [{ id, from, to, subject, text, html, date }] } newest first;
//      GET /messages/ID; DELETE /messages (empties the box); GET / answers 200 (for wait-http.mjs).
import { randomUUID, timingSafeEqual } from "node:crypto";
import { mkdir, readdir, readFile, rm, writeFile } from "node:fs/promises";
import { createServer } from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const [smtpPortArg, apiPortArg, directory] = process.argv.slice(2);
const smtpPort = Number(smtpPortArg);
const apiPort = Number(apiPortArg);
const user = process.env.KB_SMTP_USER;
const password = process.env.KB_SMTP_PASSWORD;
if (!Number.isInteger(smtpPort) || !Number.isInteger(apiPort) || !directory || !user || !password) {
  console.error("usage: KB_SMTP_USER=… KB_SMTP_PASSWORD=… node mail-catcher-server.mjs SMTP_PORT API_PORT DATA_DIR");
  process.exit(2);
}
await mkdir(directory, { recursive: true });

const same = (a, b) => {
  const x = Buffer.from(String(a));
  const y = Buffer.from(String(b));
  return x.length === y.length && timingSafeEqual(x, y);
};
const addresses = (field) => (field ? (Array.isArray(field) ? field : [field]).flatMap((f) => f.value.map((v) => v.address?.toLowerCase() ?? "")) : []);

const smtp = new SMTPServer({
  name: "knucklebench-mail-catcher",
  // Loopback only, so plain text is as safe as the socket; a real provider is reached over TLS.
  secure: false,
  disabledCommands: ["STARTTLS"],
  allowInsecureAuth: true,
  authMethods: ["PLAIN", "LOGIN"],
  size: 5 * 1024 * 1024,
  logger: false,
  onAuth(auth, _session, callback) {
    if (same(auth.username, user) && same(auth.password, password)) return callback(null, { user: auth.username });
    return callback(new Error("Invalid username or password"));
  },
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (mail) => {
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        const message = {
          id: randomUUID(),
          from: mail.from?.value[0]?.address ?? session.envelope.mailFrom?.address ?? "",
          to: envelopeTo.length ? envelopeTo : addresses(mail.to),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : "",
          date: new Date().toISOString(),
        };
        // The time first, so a directory listing sorts oldest to newest.
        await writeFile(path.join(directory, `${Date.now().toString().padStart(15, "0")}-${message.id}.json`), JSON.stringify(message));
        callback();
      })
      .catch((error) => callback(error));
  },
});

async function readAll() {
  const names = (await readdir(directory)).filter((n) => n.endsWith(".json")).sort().reverse();
  const out = [];
  for (const name of names) {
    try {
      out.push(JSON.parse(await readFile(path.join(directory, name), "utf8")));
    } catch {
      // a file being written: the next read sees it
    }
  }
  return out;
}

const api = createServer(async (req, res) => {
  const send = (status, body) => {
    res.writeHead(status, { "content-type": "application/json", "cache-control": "no-store" });
    res.end(JSON.stringify(body));
  };
  try {
    const url = new URL(req.url ?? "/", `http://127.0.0.1:${apiPort}`);
    if (url.pathname === "/") return send(200, { ok: true });
    const token = (req.headers.authorization ?? "").replace(/^Bearer\s+/i, "");
    if (!same(token, password)) return send(401, { error: "unauthorized" });
    if (url.pathname === "/messages" && req.method === "GET") {
      const to = url.searchParams.get("to")?.toLowerCase();
      const all = await readAll();
      return send(200, { messages: to ? all.filter((m) => m.to.includes(to)) : all });
    }
    if (url.pathname === "/messages" && req.method === "DELETE") {
      for (const name of await readdir(directory)) if (name.endsWith(".json")) await rm(path.join(directory, name), { force: true });
      return send(200, { ok: true });
    }
    const one = /^\/messages\/([0-9a-f-]{36})$/.exec(url.pathname);
    if (one && req.method === "GET") {
      const found = (await readAll()).find((m) => m.id === one[1]);
      return found ? send(200, found) : send(404, { error: "not_found" });
    }
    return send(404, { error: "not_found" });
  } catch (error) {
    return send(500, { error: String(error) });
  }
});

// A client that drops its connection (a reset mid-session) is that session's end, not the catcher's: without
// a listener smtp-server's "error" event would end the process and every later message would be lost.
smtp.on("error", (error) => console.warn(`mail catcher: a session ended with ${error.code ?? error.message}`));

await new Promise((resolve) => smtp.listen(smtpPort, "127.0.0.1", resolve));
await new Promise((resolve) => api.listen(apiPort, "127.0.0.1", resolve));
console.log(`mail catcher: SMTP on 127.0.0.1:${smtpPort}, API on http://127.0.0.1:${apiPort}, data in ${directory}`);

let closing = false;
const stop = () => {
  if (closing) return;
  closing = true;
  api.closeAllConnections();
  api.close();
  smtp.close(() => process.exit(0));
  // smtp-server waits for open sessions; a stop never waits long for an idle one.
  setTimeout(() => process.exit(0), 1000).unref();
};
for (const signal of ["SIGTERM", "SIGINT", "SIGHUP"]) process.on(signal, stop);
