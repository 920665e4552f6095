import { listMyInvitations } from "@/server/data/invitations";
import { sessionRoute } from "@/server/http/route";

export const GET = sessionRoute<object>(async (_req, signed) => Response.json({ invitations: await listMyInvitations(signed.user) }));
