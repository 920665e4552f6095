import { redirect } from "next/navigation";
import { resolveActiveWorkspace } from "@/server/data/guard";
import { pageSession } from "@/server/data/page-access";
import { firstWorkspaceIdOf, listWorkspacesOf } from "@/server/data/workspaces";

// "/kits" opens the kits of the session's active workspace.
export default async function KitsIndex() {
  const signed = await pageSession("/kits");
  const mine = await listWorkspacesOf(signed.user.id);
  const preferred = await resolveActiveWorkspace(signed);
  const active = mine.find((w) => w.id === preferred)?.id ?? (await firstWorkspaceIdOf(signed.user.id));
  if (!active) redirect("/workspaces/new");
  redirect(`/workspaces/${active}/kits`);
}
