import { AppShell } from "@/components/shell/app-shell";
import { Providers } from "@/components/providers";
import { resolveActiveWorkspace } from "@/server/data/guard";
import { pageSession } from "@/server/data/page-access";
import { listWorkspacesOf } from "@/server/data/workspaces";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const signed = await pageSession("/kits");
  const workspaces = await listWorkspacesOf(signed.user.id);
  return (
    <Providers>
      <AppShell user={signed.user} workspaces={workspaces} activeWorkspaceId={await resolveActiveWorkspace(signed)}>
        {children}
      </AppShell>
    </Providers>
  );
}
