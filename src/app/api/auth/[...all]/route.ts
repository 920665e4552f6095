import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/server/auth/auth";
import { forgetCachedSession } from "@/server/data/guard";
import { withClientAddress } from "@/server/http/client-address";

const handler = toNextJsHandler(auth);

// The rate limit counts each request against the address withClientAddress resolves, never a raw header.
export const GET = (req: Request) => handler.GET(withClientAddress(req));

export async function POST(req: Request): Promise<Response> {
  // A signed-out session must stop working on this instance at once, not when its memo lapses.
  if (new URL(req.url).pathname.endsWith("/sign-out")) forgetCachedSession(req.headers);
  return handler.POST(withClientAddress(req));
}
