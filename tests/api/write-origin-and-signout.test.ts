// Points 6 and 7 of the hardening issue: writes only from the app's own origin and only as JSON, checked
// before anything is stored; and a signed-out session cookie stops working at once in every spelling.
import { beforeAll, describe, expect, it } from "vitest";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import * as preferencesRoute from "@/app/api/me/preferences/route";
import * as invitationsRoute from "@/app/api/workspaces/[workspaceId]/invitations/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { BASE, call, signUp, uniqueEmail, type CallOptions } from "../helpers/api";

type P = { workspaceId: string };
type K = { workspaceId: string; kitId: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let kitId: string;

const kitNames = async () => (await call<P>(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie })).json.kits.map((k: { name: string }) => k.name) as string[];
const kitVersion = async () => (await call<K>(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kitId}`, { workspaceId: ws, kitId }, { cookie: owner.cookie })).json.kit.version as number;
const invitationCount = async () => (await call<P>(invitationsRoute.GET, "GET", `/api/workspaces/${ws}/invitations`, { workspaceId: ws }, { cookie: owner.cookie })).json.invitations.length as number;
const lengthUnit = async () => (await call<object>(preferencesRoute.GET, "GET", "/api/me/preferences", {}, { cookie: owner.cookie })).json.preferences.lengthUnit as string;

beforeAll(async () => {
  owner = await signUp("Hedda Lorne");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  const created = await call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, body: { name: "Ridge 10 front", scale: "1:10" } });
  expect(created.status).toBe(201);
  kitId = created.json.kit.id;
});

// Each write route with a body that would succeed, and a read that shows whether it did.
type Write = { name: string; send: (opts: CallOptions) => ReturnType<typeof call>; unchanged: () => Promise<void>; okStatus: number };
const writes = (): Write[] => [
  {
    name: "kits POST",
    send: (opts) => call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, ...opts }),
    unchanged: async () => expect(await kitNames()).not.toContain("Forged kit"),
    okStatus: 201,
  },
  {
    name: "members invite POST",
    send: (opts) => call<P>(membersRoute.POST, "POST", `/api/workspaces/${ws}/members`, { workspaceId: ws }, { cookie: owner.cookie, ...opts }),
    unchanged: async () => expect(await invitationCount()).toBe(0),
    okStatus: 202,
  },
  {
    name: "layout PUT",
    send: (opts) => call<K>(layoutRoute.PUT, "PUT", `/api/workspaces/${ws}/kits/${kitId}/layout`, { workspaceId: ws, kitId }, { cookie: owner.cookie, ...opts }),
    unchanged: async () => expect(await kitVersion()).toBe(1),
    okStatus: 200,
  },
  {
    name: "preferences PUT",
    send: (opts) => call<object>(preferencesRoute.PUT, "PUT", "/api/me/preferences", {}, { cookie: owner.cookie, ...opts }),
    unchanged: async () => expect(await lengthUnit()).toBe("mm"),
    okStatus: 200,
  },
];
const bodyOf: Record<string, () => unknown> = {
  "kits POST": () => ({ name: "Forged kit", scale: "1:10" }),
  "members invite POST": () => ({ email: uniqueEmail("outsider"), role: "admin" }),
  "layout PUT": () => ({ version: 1, layout: TARNWICK_10_BASE }),
  "preferences PUT": () => ({ lengthUnit: "in" }),
};

describe("writes are accepted only from the app's own origin, as JSON (point 6)", () => {
  it.each(["kits POST", "members invite POST", "layout PUT", "preferences PUT"])("%s: refused from another origin, without Origin, or not as JSON; nothing stored", async (name) => {
    const w = writes().find((x) => x.name === name)!;
    const raw = JSON.stringify(bodyOf[name]!());

    const evil = await w.send({ rawBody: raw, headers: { origin: "http://evil.example", "content-type": "application/json" } });
    expect(evil.status).toBe(403);
    expect(evil.json.error.code).toBe("cross_origin");
    await w.unchanged();

    const noOrigin = await w.send({ rawBody: raw, omitOrigin: true });
    expect(noOrigin.status).toBe(403);
    expect(noOrigin.json.error.code).toBe("cross_origin");
    await w.unchanged();

    const textPlain = await w.send({ rawBody: raw, headers: { "content-type": "text/plain;charset=json" } });
    expect(textPlain.status).toBe(415);
    await w.unchanged();

    const emptyType = await w.send({ rawBody: raw, headers: { "content-type": "" } });
    expect(emptyType.status).toBe(415);
    await w.unchanged();
  });

  it("a body with no content type at all (what a no-cors fetch of bytes sends) → 415, nothing stored", async () => {
    const req = new Request(`${BASE}/api/workspaces/${ws}/kits`, {
      method: "POST",
      headers: { cookie: owner.cookie, origin: new URL(BASE).origin },
      body: new TextEncoder().encode(JSON.stringify({ name: "Untyped kit", scale: "1:10" })),
    });
    expect(req.headers.get("content-type")).toBeNull();
    const res = await kitsRoute.POST(req, { params: Promise.resolve({ workspaceId: ws }) });
    expect(res.status).toBe(415);
    expect(await kitNames()).not.toContain("Untyped kit");
  });

  it("the same writes from the app's origin as application/json work", async () => {
    for (const w of writes()) {
      const ok = await w.send({ body: bodyOf[w.name]!() });
      expect(ok.status, w.name).toBe(w.okStatus);
    }
    expect(await kitNames()).toContain("Forged kit");
    expect(await invitationCount()).toBe(1);
    expect(await kitVersion()).toBe(2);
    expect(await lengthUnit()).toBe("in");
  });
});

// The session cookie's value carries a signature in base64 that has `/`, `+` or `=`; better-auth sends it
// URL-encoded, and it reads the cookie decoded, so both spellings name the same session.
function spellings(cookie: string): { encoded: string; decoded: string } {
  const [name, ...rest] = cookie.split("; ").find((c) => c.includes("session_token="))!.split("=");
  const value = rest.join("=");
  const decoded = decodeURIComponent(value);
  return { encoded: `${name}=${encodeURIComponent(decoded)}`, decoded: `${name}=${decoded}` };
}

async function signOut(cookie: string) {
  const res = await authPost(new Request(`${BASE}/api/auth/sign-out`, { method: "POST", headers: { cookie, origin: new URL(BASE).origin } }));
  expect(res.status).toBe(200);
}

const read = (cookie: string) => call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie });
const write = (cookie: string) => call<object>(preferencesRoute.PUT, "PUT", "/api/me/preferences", {}, { cookie, body: { lengthUnit: "in" } });

describe("a signed-out session cookie stops working at once in every spelling (point 7)", () => {
  it.each([["encoded", "decoded"], ["decoded", "encoded"], ["encoded", "encoded"], ["decoded", "decoded"]] as const)(
    "signed out with the %s cookie, then the %s one gets 401 on a read and a write",
    async (outWith, thenWith) => {
      const who = await signUp("Ansel Brody");
      const s = spellings(who.cookie);
      expect(s.encoded).not.toBe(s.decoded); // the test means something only if the spellings differ
      // Both spellings work and are now in the session memo.
      for (const c of [s.encoded, s.decoded]) {
        expect((await read(c)).status).toBe(200);
        expect((await write(c)).status).toBe(200);
      }
      await signOut(s[outWith]);
      // Straight away, well within the memo's 10 s.
      for (const c of [s[thenWith], s.encoded, s.decoded]) {
        expect((await read(c)).status).toBe(401);
        expect((await write(c)).status).toBe(401);
      }
    },
  );
});
