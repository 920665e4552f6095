import type { Metadata } from "next";
import { pageWorkspace } from "@/server/data/page-access";
import { KitSheet } from "./_components/kit-sheet";

export const metadata: Metadata = { title: "Kit analysis" };

export default async function KitPage({ params }: { params: Promise<{ workspaceId: string; kitId: string }> }) {
  const { workspaceId, kitId } = await params;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits/${kitId}`);
  return <KitSheet workspaceId={access.workspace.id} kitId={kitId} />;
}
