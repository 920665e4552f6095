"use client";
import { useQuery } from "@tanstack/react-query";
import { Spinner } from "@/components/ui/button";
import { EmptyState, ErrorNotice } from "@/components/ui/notice";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { KitSummary } from "@/contracts/kits";
import { CreateKitForm } from "./create-kit-form";
import { KitRow } from "./kit-row";

export function KitsPanel({ workspaceId, workspaceName, canWrite }: { workspaceId: string; workspaceName: string; canWrite: boolean }) {
  const kits = useQuery({
    queryKey: queryKeys.kits(workspaceId),
    queryFn: ({ signal }) => api<{ kits: KitSummary[] }>(`/api/workspaces/${workspaceId}/kits`, { signal }).then((r) => r.kits),
  });

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
      <section aria-labelledby="kits-heading">
        <div className="mb-3 flex items-baseline justify-between">
          <h1 id="kits-heading" className="text-xl font-semibold">Kits <span className="font-normal text-ink-muted">in {workspaceName}</span></h1>
          {kits.isFetching && !kits.isPending ? <Spinner label="Refreshing" /> : null}
        </div>
        {kits.isPending ? (
          <div className="rounded-lg border border-ink/10 bg-white p-6 text-sm text-ink-muted"><Spinner label="Loading kits…" /></div>
        ) : kits.isError ? (
          <ErrorNotice title="Could not load the kits" message={kits.error.message} onRetry={() => kits.refetch()} />
        ) : kits.data.length === 0 ? (
          <EmptyState title="No kits yet">
            {canWrite ? "Create the first one with the form beside this list." : "Nobody in this workspace has created a kit yet."}
          </EmptyState>
        ) : (
          <ul aria-label="Kits" className="divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white">
            {kits.data.map((kit) => (
              <KitRow key={kit.id} kit={kit} workspaceId={workspaceId} canWrite={canWrite} />
            ))}
          </ul>
        )}
      </section>
      {canWrite ? (
        <aside className="h-fit rounded-lg border border-ink/10 bg-white p-4">
          <CreateKitForm workspaceId={workspaceId} />
        </aside>
      ) : (
        <aside className="h-fit rounded-lg border border-ink/10 bg-white p-4 text-sm text-ink-muted">
          You can read this workspace&apos;s kits. Ask an admin for the editor role to create or change them.
        </aside>
      )}
    </div>
  );
}
