// Point 9 of the hardening issue: an unexpected error answers 500 `internal` with an id, and the server's
// line names the route, the error and that id, never the values the user sent (names, notes, e-mail
// addresses) nor the query string.
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { DrizzleQueryError } from "drizzle-orm/errors";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { db } from "@/server/db/client";
import { call, signUp } from "../helpers/api";

type P = { workspaceId: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let ws: string;

beforeAll(async () => {
  owner = await signUp("Hedda Lorne");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
});

afterEach(() => vi.restoreAllMocks());

/** A failing query as drizzle-orm reports it: the SQL, its values, and PostgreSQL's error (which quotes one) as the cause. */
function failedQuery(params: unknown[], quoted: string): DrizzleQueryError {
  const cause = Object.assign(new Error(`value too long for type character varying(120): "${quoted}"`), { code: "22001" });
  return new DrizzleQueryError('insert into "kits" ("id", "workspace_id", "name", "notes") values ($1, $2, $3, $4) returning "id"', params, cause);
}

describe("a 500's log line carries the route, the error and an id, not the user's values (point 9)", () => {
  it("kits POST whose insert fails: 500 internal with an errorId; the line has neither name, notes, e-mail nor query string", async () => {
    const name = "Kit of Hedda Lorne";
    const notes = "ring hedda.lorne@test.example about the knuckle";
    // A kit and its first revision are inserted in one transaction: the insert fails inside it.
    const failing = () => {
      throw failedQuery(["0b5c…", ws, name, notes], name);
    };
    vi.spyOn(db, "insert").mockImplementation(failing);
    vi.spyOn(db, "transaction").mockImplementation(async (run) => run({ insert: failing } as unknown as Parameters<typeof run>[0]));
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const res = await call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits?by=hedda.lorne%40test.example`, { workspaceId: ws }, { cookie: owner.cookie, body: { name, scale: "1:10", notes } });
    expect(res.status).toBe(500);
    expect(res.json.error.code).toBe("internal");
    const errorId = res.json.error.errorId as string;
    expect(errorId).toMatch(/^[0-9a-f-]{36}$/);
    expect(JSON.stringify(res.json)).not.toContain("Failed query");

    expect(logged).toHaveBeenCalledTimes(1);
    const line = logged.mock.calls[0]!.map(String).join(" ");
    expect(line).toContain(errorId);
    expect(line).toContain(`POST /api/workspaces/${ws}/kits`);
    expect(line).toContain("Failed query: insert into \"kits\""); // the parameterised SQL stays, its values go
    expect(line).toContain("[22001]"); // the SQLSTATE of the cause stays: it says what went wrong
    for (const secret of ["Hedda", "hedda.lorne", "knuckle", "by=", "%40", owner.email]) expect(line).not.toContain(secret);
  });

  it("members invite POST failing with an e-mail in a quoted message: the line keeps the route and id, drops the address", async () => {
    const email = "pia.outsider@test.example";
    vi.spyOn(db, "insert").mockImplementation(() => {
      throw Object.assign(new Error(`duplicate key value violates unique constraint "invitations_email_key": Key (email)=('${email}') already exists.`), { code: "23505" });
    });
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const res = await call<P>(membersRoute.POST, "POST", `/api/workspaces/${ws}/members`, { workspaceId: ws }, { cookie: owner.cookie, body: { email, role: "editor" } });
    expect(res.status).toBe(500);
    expect(res.json.error.code).toBe("internal");
    const line = logged.mock.calls.map((c) => c.map(String).join(" ")).join("\n");
    expect(line).toContain(res.json.error.errorId);
    expect(line).toContain(`POST /api/workspaces/${ws}/members`);
    expect(line).toContain("[23505]");
    expect(line).not.toContain("pia.outsider");
  });
});
