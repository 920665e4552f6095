// Share links and comments pinned to the drawing, through their routes against the real database: an
// anonymous reader opens a link (head or pinned revision) and downloads its exports; nothing but an allowed
// comment is written through a link; revoked and expired links answer 404; comments (threads, replies,
// resolve, reopen, delete) by role; markup stays text; the comment rate limit answers 429 with Retry-After.
import { execFileSync } from "node:child_process";
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { parse as parseCsv } from "csv-parse/sync";
import DxfParser from "dxf-parser";
import { DOMParser } from "@xmldom/xmldom";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as shareRoute from "@/app/api/share/[token]/route";
import * as shareCommentsRoute from "@/app/api/share/[token]/comments/route";
import * as shareExportRoute from "@/app/api/share/[token]/exports/[file]/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as linksRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/share-links/route";
import * as linkRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/share-links/[linkId]/route";
import * as commentsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/comments/route";
import * as commentRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/comments/[commentId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { COMMENT_RATE } from "@/server/http/rate-limit";

const COMMENT_LIMIT = COMMENT_RATE.max;
import { noticeRecipients } from "@/server/data/comment-notice";
import { db } from "@/server/db/client";
import { kitComments, shareLinks } from "@/server/db/schema";
import { BASE, call, download, fromAddress, randomClientIp, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";
import { messagesTo, waitForMail } from "../helpers/mail";

type K = { workspaceId: string; kitId: string };
type T = { token: string };

const MARKUP = `<script>alert("x")</script><img src=x onerror=alert(1)> & <b>bold</b>`;
const OUT = path.join(process.cwd(), ".data", "share-test");

let owner: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let viewer: Awaited<ReturnType<typeof signUp>>;
let outsider: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let kitId: string;

const kp = () => ({ workspaceId: ws, kitId });
const kitPath = (rest = "") => `/api/workspaces/${ws}/kits/${kitId}${rest}`;

async function makeLink(who: { cookie: string }, body: Record<string, unknown>) {
  return call<K>(linksRoute.POST, "POST", kitPath("/share-links"), kp(), { cookie: who.cookie, body });
}
const openShared = (token: string) => call<T>(shareRoute.GET, "GET", `/api/share/${token}`, { token });
const sharedComments = (token: string) => call<T>(shareCommentsRoute.GET, "GET", `/api/share/${token}/comments`, { token });
const postShared = (token: string, body: unknown, ip = randomClientIp()) =>
  call<T>(shareCommentsRoute.POST, "POST", `/api/share/${token}/comments`, { token }, { body, headers: fromAddress(ip) });
const sharedFile = (token: string, file: string, query = "") =>
  download<{ token: string; file: string }>(shareExportRoute.GET, `/api/share/${token}/exports/${file}${query}`, { token, file });

beforeAll(async () => {
  owner = await signUp("Odile Fenwick");
  editor = await signUp("Bram Castellan");
  viewer = await signUp("Nell Ashgrove");
  outsider = await signUp("Tiago Wren");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, editor, "editor");
  await addMemberByInvitation(owner, ws, viewer, "viewer");
  // The kit's name holds markup: it must come back as the same text everywhere.
  const created = await call<{ workspaceId: string }>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, {
    cookie: owner.cookie,
    body: { name: `Harrowgate <i>10</i> <script>x()</script>`, scale: "1:10", layout: TARNWICK_10_BASE },
  });
  expect(created.status).toBe(201);
  kitId = created.json.kit.id;
});

describe("making, listing and revoking share links", () => {
  it("an editor makes a link (the token once, 256 random bits) and the editors list it; a viewer and an outsider may not", async () => {
    const made = await makeLink(editor, { allowComments: true, label: "For the machinist", expiresInDays: 7 });
    expect(made.status).toBe(201);
    expect(made.json.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(made.json.path).toBe(`/shared/${made.json.token}`);
    expect(made.json.link).toMatchObject({ revision: null, allowComments: true, label: "For the machinist", state: "active", createdByName: "Bram Castellan" });
    const expiresIn = new Date(made.json.link.expiresAt).getTime() - Date.now();
    expect(expiresIn).toBeGreaterThan(6.9 * 86_400_000);
    expect(expiresIn).toBeLessThanOrEqual(7 * 86_400_000);
    // Only the hash is stored: the token itself appears nowhere in the row.
    const [row] = await db.select().from(shareLinks).where(eq(shareLinks.id, made.json.link.id));
    expect(JSON.stringify(row)).not.toContain(made.json.token);
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const listed = await call<K>(linksRoute.GET, "GET", kitPath("/share-links"), kp(), { cookie: owner.cookie });
    expect(listed.status).toBe(200);
    expect(listed.json.links.map((l: { id: string }) => l.id)).toContain(made.json.link.id);
    expect(JSON.stringify(listed.json)).not.toContain(made.json.token);

    expect((await makeLink(viewer, {})).status).toBe(403);
    expect((await call<K>(linksRoute.GET, "GET", kitPath("/share-links"), kp(), { cookie: viewer.cookie })).status).toBe(403);
    expect((await makeLink(outsider, {})).status).toBe(403);
  });

  it("refuses a bad body with 422 naming the field", async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ expiresInDays: 0 }, "expiresInDays"],
      [{ expiresInDays: 400 }, "expiresInDays"],
      [{ revision: 1.5 }, "revision"],
      [{ allowComments: "yes" }, "allowComments"],
      [{ label: "a\u0007b" }, "label"],
      [{ token: "chosen" }, "(body)"],
    ];
    for (const [body, field] of cases) {
      const res = await makeLink(editor, body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(res.json.error.fields[0].path, JSON.stringify(body)).toBe(field);
    }
    expect((await makeLink(editor, { revision: 99 })).status).toBe(404);
  });
});

describe("reading through a share link, anonymously", () => {
  it("opens the kit's head: name (as text), revision and layout, kept out of search engines", async () => {
    const { json: made } = await makeLink(editor, {});
    const res = await openShared(made.token);
    expect(res.status).toBe(200);
    expect(res.headers.get("x-robots-tag")).toBe("noindex, nofollow");
    expect(res.headers.get("cache-control")).toBe("private, no-store");
    expect(res.json.shared).toMatchObject({ kitName: `Harrowgate <i>10</i> <script>x()</script>`, revision: 1, pinned: false, allowComments: false, scale: "1:10" });
    expect(res.json.shared.layout.frontView.lowerInner).toEqual(TARNWICK_10_BASE.frontView.lowerInner);
    expect(res.json.shared.meta).toBeUndefined();
  });

  it("a link to revision 1 keeps showing revision 1 after a save; a head link follows the head", async () => {
    const pinned = (await makeLink(editor, { revision: 1 })).json;
    const head = (await makeLink(editor, {})).json;
    const moved = { ...TARNWICK_10_BASE, frontView: { ...TARNWICK_10_BASE.frontView, lowerInner: { ...TARNWICK_10_BASE.frontView.lowerInner, z: TARNWICK_10_BASE.frontView.lowerInner.z + 1 } } };
    const kit = await call<K>(kitRoute.GET, "GET", kitPath(), kp(), { cookie: owner.cookie });
    const saved = await call<K>(layoutRoute.PUT, "PUT", kitPath("/layout"), kp(), { cookie: editor.cookie, body: { version: kit.json.kit.version, layout: moved } });
    expect(saved.status).toBe(200);
    const a = await openShared(pinned.token);
    expect(a.json.shared).toMatchObject({ revision: 1, pinned: true });
    expect(a.json.shared.layout.frontView.lowerInner.z).toBe(TARNWICK_10_BASE.frontView.lowerInner.z);
    const b = await openShared(head.token);
    expect(b.json.shared).toMatchObject({ revision: 2, pinned: false });
    expect(b.json.shared.layout.frontView.lowerInner.z).toBe(TARNWICK_10_BASE.frontView.lowerInner.z + 1);
  });

  it("downloads the shared revision's sheet, DXF, CSV and SVG, and they parse", async () => {
    const { json: made } = await makeLink(editor, { revision: 1 });
    mkdirSync(OUT, { recursive: true });
    const pdf = await sharedFile(made.token, "sheet.pdf", "?paper=a4");
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect(pdf.headers.get("x-robots-tag")).toBe("noindex, nofollow");
    expect(pdf.headers.get("content-disposition")).toMatch(/-rev1-sheet\.pdf"$/);
    writeFileSync(path.join(OUT, "shared-sheet.pdf"), pdf.bytes);
    const text = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", path.join(OUT, "shared-sheet.pdf"), "-"], { encoding: "utf8" });
    expect(text).toContain("Harrowgate <i>10</i> <script>x()</script>");
    expect(text).toMatch(/Kit\s+Revision\s+Sheet\s*\n/);
    expect(text).toMatch(/<\/script> +1 +1 of \d/);

    const dxf = new DxfParser().parseSync((await sharedFile(made.token, "views.dxf")).text)!;
    type Line = { type: string; layer: string; vertices: { x: number; y: number }[] };
    const f = TARNWICK_10_BASE.frontView;
    const near = (v: { x: number; y: number }, p: { y: number; z: number }) => Math.abs(v.x - p.y) < 0.001 && Math.abs(v.y - p.z) < 0.001;
    const arms = (dxf.entities as unknown as Line[]).filter((e) => e.type === "LINE" && e.layer === "ARMS");
    expect(arms.some((e) => near(e.vertices[0]!, f.lowerInner) && near(e.vertices[1]!, f.lowerOuter))).toBe(true);

    const csv = await sharedFile(made.token, "envelope.csv", "?travelSteps=5&steerSteps=7");
    expect(csv.status).toBe(200);
    const rows = parseCsv(csv.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(35);
    expect(Object.keys(rows[0]!)).toContain("left_joint_angle_deg");

    const svg = await sharedFile(made.token, "front.svg");
    expect(svg.headers.get("content-type")).toBe("image/svg+xml; charset=utf-8");
    const doc = new DOMParser().parseFromString(svg.text, "image/svg+xml");
    expect(doc.documentElement!.nodeName).toBe("svg");
    expect(doc.getElementsByTagName("line").length + doc.getElementsByTagName("path").length + doc.getElementsByTagName("polyline").length).toBeGreaterThan(5);
    // The kit's markup is text in the SVG: no <script> element made from it.
    expect(doc.getElementsByTagName("script").length).toBe(0);

    expect((await sharedFile(made.token, "secrets.txt")).status).toBe(404);
    const bad = await sharedFile(made.token, "sheet.pdf", "?paper=a3");
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("paper");
    // A link shows its own revision: asking for another is refused, naming the parameter, not ignored.
    const other = await sharedFile(made.token, "sheet.pdf", "?revision=2");
    expect(other.status).toBe(422);
    expect(JSON.stringify(other.json.error)).toContain("revision");
  });
});

describe("nothing but an allowed comment is written through a share link", () => {
  it("the share API's only write is the comment POST; every other method on it is absent (Next answers 405)", () => {
    const dir = path.join(process.cwd(), "src/app/api/share");
    const files = (function walk(d: string): string[] {
      return readdirSync(d).flatMap((n) => (statSync(path.join(d, n)).isDirectory() ? walk(path.join(d, n)) : n === "route.ts" ? [path.join(d, n)] : []));
    })(dir);
    expect(files.length).toBe(3);
    const writes = files.flatMap((f) => [...readFileSync(f, "utf8").matchAll(/export const (POST|PUT|PATCH|DELETE)\b/g)].map((m) => `${path.relative(dir, f)} ${m[1]}`));
    expect(writes).toEqual([path.join("[token]", "comments", "route.ts") + " POST"]);
    expect(Object.keys(shareRoute).filter((k) => k !== "GET")).toEqual([]);
    expect(Object.keys(shareExportRoute).filter((k) => k !== "GET")).toEqual([]);
  });

  it("the workspace's write routes, reached with a share link's token and no session, answer 401 and write nothing", async () => {
    const { json: made } = await makeLink(editor, { allowComments: true });
    const withToken = { headers: { authorization: `Bearer ${made.token}`, "x-share-token": made.token } };
    const before = await call<K>(kitRoute.GET, "GET", kitPath(), kp(), { cookie: owner.cookie });
    const attempts = [
      await call<K>(kitRoute.PATCH, "PATCH", `${kitPath()}?token=${made.token}`, kp(), { ...withToken, body: { version: before.json.kit.version, name: "Renamed" } }),
      await call<K>(kitRoute.DELETE, "DELETE", `${kitPath()}?token=${made.token}`, kp(), withToken),
      await call<K>(layoutRoute.PUT, "PUT", `${kitPath("/layout")}?token=${made.token}`, kp(), { ...withToken, body: { version: before.json.kit.version, layout: TARNWICK_10_BASE } }),
      await call<K>(linksRoute.POST, "POST", `${kitPath("/share-links")}?token=${made.token}`, kp(), { ...withToken, body: {} }),
      await call(linkRoute.DELETE, "DELETE", kitPath(`/share-links/${made.link.id}`), { ...kp(), linkId: made.link.id }, withToken),
      await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { ...withToken, body: { revision: 1, view: "front", xMm: 0, yMm: 0, body: "hi" } }),
      await call<{ workspaceId: string }>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { ...withToken, body: { name: "New", scale: "1:10", layout: TARNWICK_10_BASE } }),
    ];
    for (const a of attempts) {
      expect(a.status).toBe(401);
      expect(a.json.error.code).toBe("unauthenticated");
    }
    const after = await call<K>(kitRoute.GET, "GET", kitPath(), kp(), { cookie: owner.cookie });
    expect(after.json.kit).toMatchObject({ name: before.json.kit.name, version: before.json.kit.version });
    expect((await openShared(made.token)).status).toBe(200);
  });

  it("a link that does not allow comments refuses to post (403 comments_not_allowed) and to list them, and stores nothing", async () => {
    const { json: made } = await makeLink(editor, { allowComments: false });
    const before = await db.select({ n: sql<number>`count(*)::int` }).from(kitComments).where(eq(kitComments.kitId, kitId));
    const res = await postShared(made.token, { revision: 2, view: "front", xMm: 1, yMm: 2, body: "Looks good", authorName: "Visiting reviewer" });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("comments_not_allowed");
    expect((await sharedComments(made.token)).status).toBe(403);
    const after = await db.select({ n: sql<number>`count(*)::int` }).from(kitComments).where(eq(kitComments.kitId, kitId));
    expect(after[0]!.n).toBe(before[0]!.n);
  });
});

describe("revoked and expired links", () => {
  it("a revoked link answers 404 at once, everywhere, and shows as revoked in the list", async () => {
    const { json: made } = await makeLink(editor, { allowComments: true });
    expect((await openShared(made.token)).status).toBe(200);
    const revoked = await call(linkRoute.DELETE, "DELETE", kitPath(`/share-links/${made.link.id}`), { ...kp(), linkId: made.link.id }, { cookie: editor.cookie });
    expect(revoked.status).toBe(200);
    expect(revoked.json.link.state).toBe("revoked");
    const page = await openShared(made.token);
    expect(page.status).toBe(404);
    expect(page.headers.get("x-robots-tag")).toBe("noindex, nofollow");
    expect((await sharedComments(made.token)).status).toBe(404);
    expect((await postShared(made.token, { revision: 2, view: "top", xMm: 0, yMm: 0, body: "late", authorName: "Late" })).status).toBe(404);
    expect((await sharedFile(made.token, "front.svg")).status).toBe(404);
    const listed = await call<K>(linksRoute.GET, "GET", kitPath("/share-links"), kp(), { cookie: editor.cookie });
    expect(listed.json.links.find((l: { id: string }) => l.id === made.link.id).state).toBe("revoked");
    // A viewer may not revoke; an unknown link id is a 404.
    expect((await call(linkRoute.DELETE, "DELETE", kitPath(`/share-links/${made.link.id}`), { ...kp(), linkId: made.link.id }, { cookie: viewer.cookie })).status).toBe(403);
    expect((await call(linkRoute.DELETE, "DELETE", kitPath("/share-links/nope"), { ...kp(), linkId: "nope" }, { cookie: editor.cookie })).status).toBe(404);
  });

  it("an expired link answers 404, as do a made-up token and one of the wrong shape", async () => {
    const { json: made } = await makeLink(editor, { expiresInDays: 1 });
    expect((await openShared(made.token)).status).toBe(200);
    await db.update(shareLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(shareLinks.id, made.link.id));
    expect((await openShared(made.token)).status).toBe(404);
    expect((await sharedFile(made.token, "sheet.pdf")).status).toBe(404);
    const listed = await call<K>(linksRoute.GET, "GET", kitPath("/share-links"), kp(), { cookie: editor.cookie });
    expect(listed.json.links.find((l: { id: string }) => l.id === made.link.id).state).toBe("expired");
    expect((await openShared("A".repeat(43))).status).toBe(404);
    expect((await openShared("short")).status).toBe(404);
  });
});

describe("comments", () => {
  it("a reviewer's comment through a link that allows it reaches the kit's members, as text", async () => {
    const { json: made } = await makeLink(editor, { allowComments: true });
    const res = await postShared(made.token, { revision: 2, view: "top", xMm: 12.5, yMm: -30, body: MARKUP, authorName: "<b>Guest</b> reviewer" });
    expect(res.status).toBe(201);
    expect(res.json.comment).toMatchObject({ body: MARKUP, authorName: "<b>Guest</b> reviewer", viaShareLink: true, view: "top", xMm: 12.5, yMm: -30, revision: 2, canDelete: false });
    // Every member sees it in the kit's list.
    for (const who of [owner, editor, viewer]) {
      const list = await call<K>(commentsRoute.GET, "GET", kitPath("/comments"), kp(), { cookie: who.cookie });
      expect(list.status).toBe(200);
      const t = list.json.threads.find((x: { id: string }) => x.id === res.json.comment.id);
      expect(t).toMatchObject({ body: MARKUP, authorName: "<b>Guest</b> reviewer", viaShareLink: true });
    }
    // The notice reaches every member (read back from the local mail catcher): the body as typed in the
    // text part, escaped in the HTML part, with a link to the kit at that revision.
    const to = await noticeRecipients(ws, null);
    expect(to.sort()).toEqual([owner.email, editor.email, viewer.email].sort());
    for (const who of [owner, editor, viewer]) {
      const mail = await waitForMail(who.email, /^<b>Guest<\/b> reviewer \(through a share link\) commented on Harrowgate/);
      expect(mail.subject).toContain("Harrowgate <i>10</i> <script>x()</script>");
      expect(mail.text).toContain(MARKUP);
      expect(mail.text).toContain(`${BASE}/workspaces/${ws}/kits/${kitId}?revision=2`);
      expect(mail.html).not.toMatch(/<script|<img|<b>|<i>/);
      expect(mail.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;");
      expect(mail.html).toContain("Harrowgate &lt;i&gt;10&lt;/i&gt;");
    }
    // The reviewer sees the thread through the link; it may not be pinned to another revision.
    const shared = await sharedComments(made.token);
    expect(shared.json.threads.map((t: { id: string }) => t.id)).toContain(res.json.comment.id);
    const other = await postShared(made.token, { revision: 1, view: "front", xMm: 0, yMm: 0, body: "old", authorName: "R" });
    expect(other.status).toBe(422);
    expect(other.json.error.fields[0].path).toBe("revision");
  });

  it("refuses control characters, an empty or too long body, a missing name and a bad pin with 422 naming the field", async () => {
    const { json: made } = await makeLink(editor, { allowComments: true });
    const pin = { revision: 2, view: "front", xMm: 0, yMm: 0 };
    const cases: [Record<string, unknown>, string][] = [
      [{ ...pin, body: "a\u0000b", authorName: "R" }, "body"],
      [{ ...pin, body: "   ", authorName: "R" }, "body"],
      [{ ...pin, body: "x".repeat(2001), authorName: "R" }, "body"],
      [{ ...pin, body: "ok", authorName: "" }, "authorName"],
      [{ ...pin, body: "ok", authorName: "R\u001b[31m" }, "authorName"],
      [{ ...pin, view: "side", body: "ok", authorName: "R" }, "view"],
    ];
    for (const [body, field] of cases) {
      const res = await postShared(made.token, body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(JSON.stringify(res.json.error.fields), JSON.stringify(body)).toContain(`"path":"${field}"`);
    }
    const member = await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: viewer.cookie, body: { ...pin, xMm: Number.MAX_VALUE, body: "far" } });
    expect(member.status).toBe(422);
    expect(member.json.error.fields[0].path).toBe("xMm");
    const noRevision = await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: viewer.cookie, body: { ...pin, revision: 50, body: "x" } });
    expect(noRevision.status).toBe(422);
    expect(noRevision.json.error.fields[0].path).toBe("revision");
  });

  it("members (a viewer too) comment, reply, resolve and reopen; the author and editors delete, others may not", async () => {
    const started = await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: viewer.cookie, body: { revision: 1, view: "joint", xMm: 3, yMm: 4, body: "Is the cup mouth chamfered?" } });
    expect(started.status).toBe(201);
    expect(started.json.comment).toMatchObject({ authorName: "Nell Ashgrove", viaShareLink: false, canDelete: true, resolvedAt: null });
    const id = started.json.comment.id;
    // Its notice goes to the other members, not to its writer.
    await waitForMail(owner.email, /^Nell Ashgrove commented on/);
    await waitForMail(editor.email, /^Nell Ashgrove commented on/);
    expect((await messagesTo(viewer.email)).filter((m) => /^Nell Ashgrove commented on/.test(m.subject))).toEqual([]);
    const reply = await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: editor.cookie, body: { parentId: id, body: "Yes, 0.3 mm." } });
    expect(reply.status).toBe(201);
    expect(reply.json.comment).toMatchObject({ parentId: id, view: "joint", xMm: 3, yMm: 4, revision: 1 });
    // A reply to the reply joins the same thread.
    const reply2 = await call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: owner.cookie, body: { parentId: reply.json.comment.id, body: "Noted." } });
    expect(reply2.json.comment.parentId).toBe(id);

    const resolved = await call(commentRoute.PATCH, "PATCH", kitPath(`/comments/${id}`), { ...kp(), commentId: id }, { cookie: viewer.cookie, body: { resolved: true } });
    expect(resolved.status).toBe(200);
    expect(resolved.json.comment).toMatchObject({ resolvedByName: "Nell Ashgrove" });
    expect(resolved.json.comment.resolvedAt).not.toBeNull();
    const reopened = await call(commentRoute.PATCH, "PATCH", kitPath(`/comments/${id}`), { ...kp(), commentId: id }, { cookie: editor.cookie, body: { resolved: false } });
    expect(reopened.json.comment).toMatchObject({ resolvedAt: null, resolvedByName: null });

    const list = await call<K>(commentsRoute.GET, "GET", kitPath("/comments"), kp(), { cookie: viewer.cookie });
    const thread = list.json.threads.find((t: { id: string }) => t.id === id);
    expect(thread.replies.map((r: { body: string }) => r.body)).toEqual(["Yes, 0.3 mm.", "Noted."]);
    // The viewer may delete their own comment but not the editor's reply.
    expect(thread.replies[0].canDelete).toBe(false);
    const del = (who: { cookie: string }, cid: string) => call(commentRoute.DELETE, "DELETE", kitPath(`/comments/${cid}`), { ...kp(), commentId: cid }, { cookie: who.cookie });
    expect((await del(viewer, reply.json.comment.id)).status).toBe(403);
    expect((await del(outsider, reply.json.comment.id)).status).toBe(403);
    expect((await del(editor, reply2.json.comment.id)).status).toBe(204);
    expect((await del(viewer, id)).status).toBe(204);
    const after = await call<K>(commentsRoute.GET, "GET", kitPath("/comments"), kp(), { cookie: viewer.cookie });
    expect(after.json.threads.some((t: { id: string }) => t.id === id)).toBe(false);
    expect((await del(editor, id)).status).toBe(404);
    // An outsider reads nothing.
    expect((await call<K>(commentsRoute.GET, "GET", kitPath("/comments"), kp(), { cookie: outsider.cookie })).status).toBe(403);
  });

  it(`the ${COMMENT_LIMIT + 1}th comment in a minute is 429 with Retry-After; another writer is not held up`, async () => {
    const busy = await signUp("Ilse Marwood");
    await addMemberByInvitation(owner, ws, busy, "viewer");
    const post = (who: { cookie: string }, n: number) =>
      call<K>(commentsRoute.POST, "POST", kitPath("/comments"), kp(), { cookie: who.cookie, body: { revision: 1, view: "front", xMm: n, yMm: 0, body: `note ${n}` } });
    for (let i = 0; i < COMMENT_LIMIT; i++) expect((await post(busy, i)).status).toBe(201);
    const refused = await post(busy, 99);
    expect(refused.status).toBe(429);
    expect(refused.json.error.code).toBe("rate_limited");
    const retry = Number(refused.headers.get("retry-after"));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(COMMENT_RATE.windowS);
    expect((await post(viewer, 1)).status).toBe(201);
    // Through a share link the count is per client address.
    const { json: made } = await makeLink(editor, { allowComments: true });
    const ip = randomClientIp();
    for (let i = 0; i < COMMENT_LIMIT; i++) expect((await postShared(made.token, { revision: 2, view: "front", xMm: i, yMm: 0, body: "x", authorName: "R" }, ip)).status).toBe(201);
    const sharedRefused = await postShared(made.token, { revision: 2, view: "front", xMm: 0, yMm: 0, body: "x", authorName: "R" }, ip);
    expect(sharedRefused.status).toBe(429);
    expect(sharedRefused.headers.get("retry-after")).toMatch(/^\d+$/);
  });
});
