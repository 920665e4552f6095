import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/server/auth/auth";
import { forgetCachedSession } from "@/server/data/guard";

const handler = toNextJsHandler(auth);

export const GET = handler.GET;

export async function POST(req: Request): Promise<Response> {
  // A signed-out session must stop working on this instance at once, not when its memo lapses.
  if (new URL(req.url).pathname.endsWith("/sign-out")) forgetCachedSession(req.headers);
  return handler.POST(req);
}
