"use client";
import Link from "next/link";
import { useParams, useRouter } from "next/navigation";
import { useTransition } from "react";
import { api } from "@/lib/api-client";
import type { WorkspaceSummary } from "@/contracts/workspaces";

export function WorkspaceSwitcher({ workspaces, activeWorkspaceId }: { workspaces: WorkspaceSummary[]; activeWorkspaceId: string | null }) {
  const router = useRouter();
  const params = useParams<{ workspaceId?: string }>();
  const current = params.workspaceId ?? activeWorkspaceId ?? workspaces[0]?.id ?? "";
  const [pending, startTransition] = useTransition();
  const role = workspaces.find((w) => w.id === current)?.role;

  return (
    <div className="flex items-center gap-2 text-sm">
      <label htmlFor="workspace-switcher" className="sr-only">Workspace</label>
      <select
        id="workspace-switcher"
        value={current}
        disabled={pending}
        onChange={(e) => {
          const id = e.target.value;
          startTransition(async () => {
            await api(`/api/workspaces/${id}/activate`, { method: "POST" }).catch(() => undefined);
            router.push(`/workspaces/${id}/kits`);
          });
        }}
        className="rounded-md border border-ink/20 bg-white px-2 py-1"
      >
        {workspaces.map((w) => (
          <option key={w.id} value={w.id}>{w.name}</option>
        ))}
      </select>
      {role ? <span className="rounded bg-steel/10 px-1.5 py-0.5 text-xs text-steel">{role}</span> : null}
      {current ? (
        <nav className="flex gap-3 pl-2">
          <Link className="hover:underline" href={`/workspaces/${current}/kits`}>Kits</Link>
          <Link className="hover:underline" href={`/workspaces/${current}/shelf`}>Shelf</Link>
          <Link className="hover:underline" href={`/workspaces/${current}/calibration`}>Calibration</Link>
          <Link className="hover:underline" href={`/workspaces/${current}/targets`}>Targets</Link>
          <Link className="hover:underline" href={`/workspaces/${current}/members`}>Members</Link>
        </nav>
      ) : null}
    </div>
  );
}
