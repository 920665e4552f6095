import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/server/auth/auth";
import { forgetCachedSession } from "@/server/data/guard";
import { withClientAddress } from "@/server/http/client-address";
import { errorResponse, notFound } from "@/server/http/errors";
import { tooManyRequests } from "@/server/http/rate-limit";
import { toErrorResponse } from "@/server/http/route";

const handler = toNextJsHandler(auth);

/**
 * better-auth's organization endpoints would let members be added or roles changed around the app's own
 * members and invitations routes (and their last-owner and consent checks). Server code calls auth.api.*
 * directly and no page calls them over HTTP, so from outside they do not exist. Case and doubled slashes
 * are folded first, so no other spelling of the path gets through.
 */
function isOrganizationEndpoint(req: Request): boolean {
  const path = new URL(req.url).pathname.toLowerCase().replace(/\/{2,}/g, "/");
  return /^\/api\/auth\/organization(\/|$)/.test(path);
}

const hidden = () => errorResponse(notFound("That endpoint"));

/**
 * better-auth's 429 carries only X-Retry-After and a vague message: answered as every rate limit of the app
 * answers (a message saying what and when, and the standard Retry-After header).
 */
function rateLimited(res: Response, req: Request): Response {
  const retryAfter = Math.max(1, Number(res.headers.get("x-retry-after")) || 60);
  const path = new URL(req.url).pathname;
  const what = path.includes("sign-up") ? "sign-up attempts" : path.includes("sign-in") ? "sign-in attempts" : path.includes("password") ? "password reset requests" : path.includes("verif") ? "confirmation requests" : "requests";
  return errorResponse(tooManyRequests(what, retryAfter));
}

/** better-auth lets a database error through (its rate limiter reads PostgreSQL first): answered as every route answers it. */
async function answered(req: Request, run: () => Promise<Response>): Promise<Response> {
  try {
    const res = await run();
    return res.status === 429 ? rateLimited(res, req) : res;
  } catch (error) {
    return toErrorResponse(error, req);
  }
}

// The rate limit counts each request against the address withClientAddress resolves, never a raw header.
export async function GET(req: Request): Promise<Response> {
  if (isOrganizationEndpoint(req)) return hidden();
  return answered(req, () => handler.GET(withClientAddress(req)));
}

export async function POST(req: Request): Promise<Response> {
  if (isOrganizationEndpoint(req)) return hidden();
  // A signed-out session must stop working on this instance at once, not when its memo lapses.
  if (new URL(req.url).pathname.endsWith("/sign-out")) forgetCachedSession(req.headers);
  return answered(req, () => handler.POST(withClientAddress(req)));
}
