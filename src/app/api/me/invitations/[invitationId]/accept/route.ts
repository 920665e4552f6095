import { acceptInvitation } from "@/server/data/invitations";
import { sessionRoute } from "@/server/http/route";

type Params = { invitationId: string };

export const POST = sessionRoute<Params>(async (_req, signed, { invitationId }) => {
  return Response.json(await acceptInvitation(signed.user, invitationId));
});
