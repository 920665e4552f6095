import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ErrorNotice } from "@/components/ui/notice";
import { SEARCH_FIGURES } from "@/contracts/design-search";
import { parseLayout } from "@/contracts/layout";
import { roleCan } from "@/contracts/roles";
import { effectiveTargets } from "@/contracts/targets";
import { getKit, kitIdOrNotFound } from "@/server/data/kits";
import { pageWorkspace } from "@/server/data/page-access";
import { getTargets } from "@/server/data/targets";
import { HttpError } from "@/server/http/errors";
import { listSearches } from "@/server/search/searches";
import { SearchPanel, type FigureOffer } from "./_components/search-panel";

export const metadata: Metadata = { title: "Design search" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function DesignSearchPage({ params, searchParams }: { params: Promise<{ workspaceId: string; kitId: string }>; searchParams: Search }) {
  const { workspaceId, kitId } = await params;
  const shown = (await searchParams).search;
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits/${kitId}/search`);
  const found = await (async () => {
    const kit = await getKit(access.workspace.id, kitIdOrNotFound(kitId));
    const [targets, searches] = await Promise.all([getTargets(access.workspace.id), listSearches(access.workspace.id, kit.id)]);
    return { kit, targets, searches };
  })().catch((error: unknown) => {
    if (error instanceof HttpError && error.status === 404) notFound();
    throw error;
  });
  const { kit, targets, searches } = found;
  const back = <Link href={`/workspaces/${access.workspace.id}/kits/${kit.id}`} className="text-sm text-steel hover:underline">← {kit.name}</Link>;
  const parsed = parseLayout(kit.layout);
  if (!parsed.ok) {
    return (
      <div className="flex flex-col gap-3">
        {back}
        <h1 className="text-2xl font-semibold">Design search</h1>
        <ErrorNotice title="This kit's layout cannot be searched from" message="Its layout does not read as a valid layout; open it in the editor, fix it and save it first." />
      </div>
    );
  }
  // What may move in this layout, with its value today (plain data for the client).
  const figures: FigureOffer[] = SEARCH_FIGURES.filter((f) => f.kind === "choice" || !f.appliesTo || f.appliesTo(parsed.layout)).map((f) =>
    f.kind === "number"
      ? { kind: "number", key: f.key, label: f.label, unit: f.unit, limit: [f.limit[0], f.limit[1]], current: f.get(parsed.layout) }
      : { kind: "choice", key: f.key, label: f.label, options: [...f.options], current: f.get(parsed.layout) },
  );
  return (
    <div className="flex flex-col gap-4">
      {back}
      <div>
        <h1 className="text-2xl font-semibold">Design search</h1>
        <p className="text-sm text-ink-muted">
          Say which figures of “{kit.name}” may move and what the layout must reach; the search analyses layouts across that space on the background workers and keeps those that reach the most lock for their strength.
        </p>
      </div>
      <SearchPanel
        workspaceId={access.workspace.id}
        kitId={kit.id}
        headRevision={kit.headRevision}
        figures={figures}
        aims={effectiveTargets(targets.targets, kit.targetOverrides)}
        canStart={roleCan(access.role, "kit", "update")}
        searches={searches}
        initialSearchId={typeof shown === "string" && searches.some((s) => s.id === shown) ? shown : (searches[0]?.id ?? null)}
      />
    </div>
  );
}
