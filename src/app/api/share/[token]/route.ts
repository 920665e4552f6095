import { readSharedKit } from "@/server/data/shared-kit";
import { shareRoute } from "@/server/http/route";

type Params = { token: string };

// What the link opens: the kit's name and scale, the revision and its layout. Read-only: no other method.
export const GET = shareRoute<Params>(async (_req, link) => {
  const { kitName, workspaceName, scale, revision, pinned, allowComments, expiresAt, layout } = await readSharedKit(link);
  return Response.json({ shared: { kitName, workspaceName, scale, revision, pinned, allowComments, expiresAt, layout } });
});
