import type { Metadata } from "next";
import { Suspense } from "react";
import { Spinner } from "@/components/ui/button";
import { roleCan } from "@/contracts/roles";
import { listMyInvitations } from "@/server/data/invitations";
import { pageWorkspace } from "@/server/data/page-access";
import { LibraryPanel } from "./_components/library-panel";
import { MyInvitations } from "./_components/my-invitations";

export const metadata: Metadata = { title: "Kits" };

export default async function KitsPage({ params }: { params: Promise<{ workspaceId: string }> }) {
  const { workspaceId } = await params;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits`);
  return (
    <>
      {/* Where everyone lands after signing in (/kits opens it), so an invitation is seen there. */}
      <MyInvitations initial={await listMyInvitations(access.user)} />
      {/* The view is read from the URL's query in the browser. */}
      <Suspense fallback={<Spinner label="Loading kits…" />}>
        <LibraryPanel workspaceId={access.workspace.id} workspaceName={access.workspace.name} canWrite={roleCan(access.role, "kit", "create")} />
      </Suspense>
    </>
  );
}
