import type { Metadata } from "next";
import { roleCan } from "@/contracts/roles";
import { pageWorkspace } from "@/server/data/page-access";
import { KitsPanel } from "./_components/kits-panel";

export const metadata: Metadata = { title: "Kits" };

export default async function KitsPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits`);
  return (
    <KitsPanel
      workspaceId={access.workspace.id}
      workspaceName={access.workspace.name}
      canWrite={roleCan(access.role, "kit", "create")}
    />
  );
}
