import { invitationTokenBody } from "@/contracts/workspaces";
import { acceptInvitationByToken } from "@/server/data/invitations";
import { readJson } from "@/server/http/body";
import { sessionRoute } from "@/server/http/route";

// The invitation link's page posts its token here (in the body: a token kept out of URLs the server logs).
export const POST = sessionRoute(async (req, signed) => {
  const { token } = await readJson(req, invitationTokenBody);
  return Response.json(await acceptInvitationByToken(signed.user, token));
});
