import type { Metadata } from "next";
import { roleCan } from "@/contracts/roles";
import { pageWorkspace } from "@/server/data/page-access";
import { ShelfPanel } from "./_components/shelf-panel";

export const metadata: Metadata = { title: "Shelf" };

export default async function ShelfPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "shelf", "read", `/workspaces/${workspaceId}/shelf`);
  return <ShelfPanel workspaceId={access.workspace.id} workspaceName={access.workspace.name} canWrite={roleCan(access.role, "shelf", "update")} />;
}
