import Link from "next/link";
import type { WorkspaceSummary } from "@/contracts/workspaces";
import { SignOutButton } from "./sign-out-button";
import { WorkspaceSwitcher } from "./workspace-switcher";

export function AppShell({
  user,
  workspaces,
  activeWorkspaceId,
  children,
}: {
  user: { name: string; email: string };
  workspaces: WorkspaceSummary[];
  activeWorkspaceId: string | null;
  children: React.ReactNode;
}) {
  return (
    // The kit editor fills the window (no page scroll, no width cap): the shell makes room when it holds one.
    <div className="flex min-h-screen flex-col has-[[data-editor]]:h-dvh has-[[data-editor]]:min-h-[44rem]">
      <header className="border-b border-ink/10 bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-4 px-4 py-2.5">
          <Link href="/kits" className="font-semibold tracking-tight text-steel">Knucklebench</Link>
          <WorkspaceSwitcher workspaces={workspaces} activeWorkspaceId={activeWorkspaceId} />
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span className="text-ink-muted" title={user.email}>{user.name}</span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 has-[[data-wide]]:max-w-[96rem] has-[[data-editor]]:flex has-[[data-editor]]:min-h-0 has-[[data-editor]]:max-w-none has-[[data-editor]]:flex-col has-[[data-editor]]:p-0">{children}</main>
      <footer className="border-t border-ink/10 px-4 py-3 text-center text-xs text-ink-muted">
        Strength figures are estimates. A design aid for models — not a sign-off for full-size or road vehicles.
      </footer>
    </div>
  );
}
