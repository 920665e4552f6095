import { declineInvitation } from "@/server/data/invitations";
import { sessionRoute } from "@/server/http/route";

type Params = { invitationId: string };

export const POST = sessionRoute<Params>(async (_req, signed, { invitationId }) => {
  await declineInvitation(signed.user, invitationId);
  return new Response(null, { status: 204 });
});
