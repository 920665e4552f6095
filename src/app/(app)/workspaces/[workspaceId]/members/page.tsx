import type { Metadata } from "next";
import { roleCan } from "@/contracts/roles";
import { pageWorkspace } from "@/server/data/page-access";
import { MembersPanel } from "./_components/members-panel";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "member", "read", `/workspaces/${workspaceId}/members`);
  return (
    <MembersPanel
      workspaceId={access.workspace.id}
      workspaceName={access.workspace.name}
      myUserId={access.user.id}
      myRole={access.role}
      canManage={roleCan(access.role, "member", "create")}
    />
  );
}
