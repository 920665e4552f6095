import type { Metadata } from "next";
import { roleCan } from "@/contracts/roles";
import { pageWorkspace } from "@/server/data/page-access";
import { getTargets } from "@/server/data/targets";
import { TargetsPanel } from "./_components/targets-panel";

export const metadata: Metadata = { title: "Targets" };

export default async function TargetsPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "target", "read", `/workspaces/${workspaceId}/targets`);
  return <TargetsPanel workspaceId={access.workspace.id} workspaceName={access.workspace.name} initial={await getTargets(access.workspace.id)} canEdit={roleCan(access.role, "target", "update")} />;
}
