import type { Metadata } from "next";
import { roleCan } from "@/contracts/roles";
import { pageWorkspace } from "@/server/data/page-access";
import { CalibrationPanel } from "./_components/calibration-panel";

export const metadata: Metadata = { title: "Calibration" };

export default async function CalibrationPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/calibration`);
  return <CalibrationPanel workspaceId={access.workspace.id} workspaceName={access.workspace.name} canApply={roleCan(access.role, "shelf", "update")} />;
}
