// Invitations by e-mail, end to end through the real local mail catcher: the admin invites an address, the
// message's link carries the token, the invitee signs up with that address and accepts through the link,
// and is a member with the invited role. The link works once, only for the invited address, not after it is
// withdrawn or expired; sending is rate-limited. Markup in the workspace's name is text in the message.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as linkAcceptRoute from "@/app/api/invitations/accept/route";
import * as acceptRoute from "@/app/api/me/invitations/[invitationId]/accept/route";
import * as invitationRoute from "@/app/api/workspaces/[workspaceId]/invitations/[invitationId]/route";
import * as invitationsRoute from "@/app/api/workspaces/[workspaceId]/invitations/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { db } from "@/server/db/client";
import { invitations, users } from "@/server/db/schema";
import { BASE, call, signUp, uniqueEmail } from "../helpers/api";
import { invitationTo, invite } from "../helpers/invitations";
import { linkIn, waitForMail } from "../helpers/mail";

type P = { workspaceId: string };
type Person = Awaited<ReturnType<typeof signUp>>;
const WORKSPACE_NAME = `<script>alert(1)</script> Dune & "Gravel" Club`;

let owner: Person;
let ws: string;

beforeAll(async () => {
  owner = await signUp("Oriane Kessel");
  const made = await call(workspacesRoute.POST, "POST", "/api/workspaces", {}, { cookie: owner.cookie, body: { name: WORKSPACE_NAME } });
  expect(made.status).toBe(201);
  ws = made.json.workspace.id;
});

const acceptByLink = (who: { cookie: string }, token: unknown) =>
  call(linkAcceptRoute.POST, "POST", "/api/invitations/accept", {}, { cookie: who.cookie, body: { token } });

/** Invites `email` and returns the token from the link in the message it received (the `count`-th one). */
async function invitedToken(email: string, role: string, count = 1): Promise<string> {
  expect((await invite(owner, ws, email, role)).status).toBe(202);
  const mail = await waitForMail(email, /invited you/, { count });
  return linkIn(mail, `${BASE}/invitations/`).slice(`${BASE}/invitations/`.length);
}

async function roleIn(workspaceId: string, email: string): Promise<string | undefined> {
  const res = await call<P>(membersRoute.GET, "GET", `/api/workspaces/${workspaceId}/members`, { workspaceId }, { cookie: owner.cookie });
  return (res.json.members as { email: string; role: string }[]).find((m) => m.email === email)?.role;
}

describe("an invitation by e-mail", () => {
  it("reaches the address with a link; a new account with that address accepts through it and has the role", async () => {
    const email = uniqueEmail("newcomer");
    expect((await invite(owner, ws, email, "editor")).status).toBe(202);
    const mail = await waitForMail(email, /invited you/);
    expect(mail.subject).toBe(`Oriane Kessel invited you to ${WORKSPACE_NAME} on Knucklebench`);
    expect(mail.text).toContain(`join the workspace “${WORKSPACE_NAME}” on Knucklebench as an editor`);
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).toContain("&lt;script&gt;alert(1)&lt;/script&gt; Dune &amp; &quot;Gravel&quot; Club");
    const link = linkIn(mail, `${BASE}/invitations/`);
    const token = link.slice(`${BASE}/invitations/`.length);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    // Only a hash of the token is stored.
    const rows = await db.select({ hash: invitations.tokenHash }).from(invitations).where(eq(invitations.email, email));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.hash).not.toContain(token);

    // The admin sees the invitation pending, its message sent.
    // (The catcher may hold the message a moment before the outbox row is marked sent.)
    const pendingRow = async () =>
      (await call<P>(invitationsRoute.GET, "GET", `/api/workspaces/${ws}/invitations`, { workspaceId: ws }, { cookie: owner.cookie })).json.invitations.find((i: { email: string }) => i.email === email);
    await expect.poll(pendingRow, { timeout: 5_000 }).toMatchObject({ role: "editor", mail: "sent" });

    const newcomer = await signUp("Sacha Vidal", email);
    const accepted = await acceptByLink(newcomer, token);
    expect(accepted.status).toBe(200);
    expect(accepted.json).toMatchObject({ workspace: { id: ws, name: WORKSPACE_NAME }, role: "editor" });
    expect(await roleIn(ws, email)).toBe("editor");
    // The link showed the address receives mail: it is confirmed now.
    const [me] = await db.select({ v: users.emailVerified }).from(users).where(eq(users.id, newcomer.userId));
    expect(me!.v).toBe(true);
    // No longer pending.
    const after = await call<P>(invitationsRoute.GET, "GET", `/api/workspaces/${ws}/invitations`, { workspaceId: ws }, { cookie: owner.cookie });
    expect(after.json.invitations.some((i: { email: string }) => i.email === email)).toBe(false);

    // A second use is refused, by the same account or any other.
    const second = await acceptByLink(newcomer, token);
    expect(second.status).toBe(410);
    expect(second.json.error.code).toBe("invitation_used");
    const other = await signUp("Ugo Fenn");
    expect((await acceptByLink(other, token)).status).toBe(410);
    expect(await roleIn(ws, other.email)).toBeUndefined();
  });

  it("is refused to an account with another address, and still works for the invited one", async () => {
    const email = uniqueEmail("rightful");
    const token = await invitedToken(email, "viewer");
    const intruder = await signUp("Vera Intrus");
    const refused = await acceptByLink(intruder, token);
    expect(refused.status).toBe(403);
    expect(refused.json.error).toMatchObject({ code: "wrong_account", message: "This invitation is for another e-mail address. Sign in with the address it was sent to." });
    expect(await roleIn(ws, intruder.email)).toBeUndefined();
    const rightful = await signUp("Rhea Tallis", email);
    expect((await acceptByLink(rightful, token)).status).toBe(200);
    expect(await roleIn(ws, email)).toBe("viewer");
  });

  it("accepted by an existing account signed in with the address, who keeps the invited role", async () => {
    const existing = await signUp("Bram Osei");
    const token = await invitedToken(existing.email, "viewer");
    const res = await acceptByLink(existing, token);
    expect(res.status).toBe(200);
    expect(await roleIn(ws, existing.email)).toBe("viewer");
  });

  it("stops working when withdrawn (404), when it expires (410), and when a new invitation replaces it", async () => {
    const email = uniqueEmail("withdrawn");
    const person = await signUp("Cleo Marsh", email);
    const token = await invitedToken(email, "editor");
    const found = await invitationTo(person, ws);
    const withdrawn = await call(invitationRoute.DELETE, "DELETE", "/x", { workspaceId: ws, invitationId: found!.id }, { cookie: owner.cookie });
    expect(withdrawn.status).toBe(204);
    expect((await acceptByLink(person, token)).status).toBe(404);

    const renewed = await invitedToken(email, "editor", 2);
    const replaced = await invitedToken(email, "viewer", 3);
    expect(replaced).not.toBe(renewed);
    expect((await acceptByLink(person, renewed)).status).toBe(404); // the earlier link stops working
    await db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.email, email));
    const expired = await acceptByLink(person, replaced);
    expect(expired.status).toBe(410);
    expect(expired.json.error.code).toBe("invitation_expired");
    expect(await roleIn(ws, email)).toBeUndefined();
  });

  it("answers a malformed or unknown token 404, a missing one 422, and nobody signed in 401", async () => {
    const someone = await signUp("Dara Quill");
    expect((await acceptByLink(someone, "short")).status).toBe(404);
    expect((await acceptByLink(someone, "A".repeat(43))).status).toBe(404);
    const missing = await call(linkAcceptRoute.POST, "POST", "/api/invitations/accept", {}, { cookie: someone.cookie, body: {} });
    expect(missing.status).toBe(422);
    expect(missing.json.error.fields[0].path).toBe("token");
    expect((await acceptByLink({ cookie: "" }, "A".repeat(43))).status).toBe(401);
  });

  it("from the list needs a confirmed address; the link itself does not", async () => {
    const email = uniqueEmail("unconfirmed");
    const person = await signUp("Ezra Pike", email);
    await invitedToken(email, "viewer");
    const found = await invitationTo(person, ws);
    const res = await call(acceptRoute.POST, "POST", "/x", { invitationId: found!.id }, { cookie: person.cookie });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("address_unconfirmed");
    expect(await roleIn(ws, email)).toBeUndefined();
  });
});

describe("sending invitations is rate-limited", () => {
  it("answers the 31st invitation in ten minutes with 429 and Retry-After; the others went out", async () => {
    const admin = await signUp("Fiona Brask");
    const list = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: admin.cookie });
    const own = list.json.workspaces[0].id as string;
    const statuses: number[] = [];
    let last: Awaited<ReturnType<typeof invite>> | undefined;
    for (let i = 0; i < 31; i++) {
      last = await invite(admin, own, uniqueEmail(`bulk${i}`), "viewer");
      statuses.push(last.status);
    }
    expect(statuses.slice(0, 30)).toEqual(Array(30).fill(202));
    expect(statuses[30]).toBe(429);
    const retryAfter = Number(last!.headers.get("retry-after"));
    expect(retryAfter).toBeGreaterThan(500);
    expect(retryAfter).toBeLessThanOrEqual(600);
    expect(last!.json.error).toMatchObject({ code: "rate_limited", message: "Too many invitations in a short time. Try again in 10 minutes." });
    // Another admin is not held back by it.
    const other = await signUp("Gus Alder");
    const otherWs = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: other.cookie })).json.workspaces[0].id as string;
    expect((await invite(other, otherWs, uniqueEmail("free"), "viewer")).status).toBe(202);
  });
});
