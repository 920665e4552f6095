import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { roleCan, type Action, type Resource } from "@/contracts/roles";
import { auth } from "../auth/auth";
import { db } from "../db/client";
import { authSecret } from "../env";
import { members, workspaces } from "../db/schema";
import { forbidden, HttpError, notFound, unauthorized } from "../http/errors";
import { firstWorkspaceIdOf, setActiveWorkspace } from "./workspaces";

export type SessionUser = { id: string; name: string; email: string };
export type Signed = { user: SessionUser; sessionId: string; activeWorkspaceId: string | null };
export type WorkspaceAccess = Signed & { workspace: { id: string; name: string; slug: string }; role: string };

// Resolving a session through better-auth costs a database read and about a millisecond, most of a small
// API call. Remember the answer for 10 s on this instance, keyed on the session token whose signature was
// verified here (not on the cookie's text, which has more than one spelling: URL-encoded or not); signing
// out forgets it at once, and a session revoked elsewhere stops working within those 10 s.
const SESSION_MEMO_MS = 10_000;
const SESSION_MEMO_MAX = 5_000;
const sessionMemo = new Map<string, { signed: Signed; until: number }>();
const SESSION_COOKIES = ["better-auth.session_token", "__Secure-better-auth.session_token"];

/**
 * Every value the request's Cookie header gives a session cookie, read as better-auth's cookie parser
 * (better-call's parseCookies) reads it: trimmed, unquoted, URL-decoded. better-auth takes the first.
 */
function sessionCookieValues(headers: Headers): string[] {
  const cookie = headers.get("cookie");
  if (!cookie) return [];
  const values: string[] = [];
  for (const pair of cookie.split(";")) {
    const eq = pair.indexOf("=");
    if (eq === -1 || !SESSION_COOKIES.includes(pair.slice(0, eq).trim())) continue;
    let value = pair.slice(eq + 1).trim();
    if (value.startsWith('"')) value = value.slice(1, -1);
    try {
      value = value.includes("%") ? decodeURIComponent(value) : value;
    } catch {
      // better-call keeps a value it cannot decode as it is
    }
    values.push(value);
  }
  return values;
}

/** The token of a signed cookie value (`token.signature`, HMAC-SHA256 in base64) when the signature holds, else null. */
function verifiedToken(value: string): string | null {
  const dot = value.lastIndexOf(".");
  if (dot < 1) return null;
  const token = value.slice(0, dot);
  const signature = Buffer.from(value.slice(dot + 1), "base64");
  const expected = createHmac("sha256", authSecret()).update(token).digest();
  return signature.length === expected.length && timingSafeEqual(signature, expected) ? token : null;
}

/** Forgets every session the request's cookies name, in whichever spelling they arrive. */
export function forgetCachedSession(headers: Headers): void {
  for (const value of sessionCookieValues(headers)) {
    const token = verifiedToken(value);
    if (token) sessionMemo.delete(token);
  }
}

/** The signed-in user, or a 401. Every page, action and route handler starts here. */
export async function requireSession(headers: Headers): Promise<Signed> {
  const values = sessionCookieValues(headers);
  if (values.length === 0) throw unauthorized();
  // The memo answers only for the token better-auth would read (the first cookie), once its signature holds.
  const token = verifiedToken(values[0]!);
  const now = Date.now();
  const memo = token ? sessionMemo.get(token) : undefined;
  if (memo && memo.until > now) return memo.signed;

  const found = await auth.api.getSession({ headers });
  if (!found) {
    if (token) sessionMemo.delete(token);
    throw unauthorized();
  }
  const { user, session } = found;
  const activeWorkspaceId = (session as { activeOrganizationId?: string | null }).activeOrganizationId ?? null;
  const signed = { user: { id: user.id, name: user.name, email: user.email }, sessionId: session.id, activeWorkspaceId };
  // Only a token better-auth itself just resolved to this session is remembered.
  if (token === session.token) {
    if (sessionMemo.size >= SESSION_MEMO_MAX) sessionMemo.delete(sessionMemo.keys().next().value!);
    sessionMemo.set(token, { signed, until: Math.min(now + SESSION_MEMO_MS, new Date(session.expiresAt).getTime()) });
  }
  return signed;
}

/**
 * The workspace a session opens by default: the one chosen last, else the first the user joined (stored
 * on first use, since the sign-up session is created before the personal workspace exists).
 */
export async function resolveActiveWorkspace(signed: Signed): Promise<string | null> {
  if (signed.activeWorkspaceId) return signed.activeWorkspaceId;
  const first = await firstWorkspaceIdOf(signed.user.id);
  if (first) {
    await setActiveWorkspace(signed.sessionId, first);
    signed.activeWorkspaceId = first; // the remembered session sees it too
  }
  return first;
}

/** Stores the session's default workspace (and drops the remembered session so the change shows at once). */
export async function chooseActiveWorkspace(headers: Headers, signed: Signed, workspaceId: string): Promise<void> {
  await setActiveWorkspace(signed.sessionId, workspaceId);
  forgetCachedSession(headers);
}

const RESOURCE_WORDS: Partial<Record<Resource, string>> = { organization: "the workspace", shelf: "the shelf", target: "the workspace's targets" };

const WORKSPACE_ID = /^[A-Za-z0-9_-]{1,64}$/;
const notAMember = () => new HttpError(403, "not_a_member", "You are not a member of this workspace.");

/**
 * The session plus the caller's membership of `workspaceId`, checked against one permission.
 * A non-member gets the same 403 whether or not the workspace exists, so nothing leaks.
 */
export async function requireWorkspaceAccess<R extends Resource>(
  headers: Headers,
  workspaceId: string,
  resource: R,
  action: Action<R>,
): Promise<WorkspaceAccess> {
  const signed = await requireSession(headers);
  // A malformed id names no workspace at all: 404, which leaks nothing (the format is public).
  if (!WORKSPACE_ID.test(workspaceId)) throw notFound("Workspace");
  const [row] = await db
    .select({ role: members.role, id: workspaces.id, name: workspaces.name, slug: workspaces.slug })
    .from(members)
    .innerJoin(workspaces, eq(workspaces.id, members.organizationId))
    .where(and(eq(members.organizationId, workspaceId), eq(members.userId, signed.user.id)))
    .limit(1);
  if (!row) throw notAMember();
  if (!roleCan(row.role, resource, action)) {
    throw forbidden(`${/^[aeiou]/i.test(row.role) ? "An" : "A"} ${row.role} of this workspace may not ${action} ${RESOURCE_WORDS[resource] ?? `${resource}s`}.`);
  }
  return { ...signed, workspace: { id: row.id, name: row.name, slug: row.slug }, role: row.role };
}
