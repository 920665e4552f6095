import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ErrorNotice } from "@/components/ui/notice";
import { revisionNumberParam } from "@/contracts/revisions";
import { loadKitEditor } from "@/server/data/kit-editor";
import { pageWorkspace } from "@/server/data/page-access";
import { HttpError } from "@/server/http/errors";
import { searchIdOrNotFound, searchResultLayout } from "@/server/search/searches";
import { KitEditor } from "./_components/kit-editor";

export const metadata: Metadata = { title: "Kit editor" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function KitPage({ params, searchParams }: { params: Promise<{ workspaceId: string; kitId: string }>; searchParams: Search }) {
  const { workspaceId, kitId } = await params;
  const query = await searchParams;
  const rawRevision = query.revision;
  // ?revision=n shows that revision read-only; anything that is not a revision number is not there.
  const revision = typeof rawRevision === "string" ? revisionNumberParam.safeParse(rawRevision) : null;
  if (revision && (!revision.success || String(revision.data) !== rawRevision)) notFound();
  const access = await pageWorkspace(workspaceId, "kit", "read", `/workspaces/${workspaceId}/kits/${kitId}${revision ? `?revision=${revision.data}` : ""}`);
  const data = await loadKitEditor(access, kitId, revision?.data ?? null).catch((error: unknown) => {
    if (error instanceof HttpError && error.status === 404) notFound();
    throw error;
  });
  if (!data.ok) {
    return (
      <div className="flex flex-col gap-3">
        <Link href={`/workspaces/${access.workspace.id}/kits`} className="text-sm text-steel hover:underline">← All kits</Link>
        <h1 className="text-2xl font-semibold">{data.kit.name}</h1>
        <ErrorNotice title="This kit cannot be opened in the editor" message={data.message} />
      </div>
    );
  }
  const k = data.kit;
  // ?search=id&layout=n opens layout n of a finished design search as an unsaved change of the latest revision.
  const wantsSearch = revision === null && typeof query.search === "string" && typeof query.layout === "string";
  if (wantsSearch && !/^[1-9]\d?$/.test(String(query.layout))) notFound();
  const fromSearch = wantsSearch
    ? await (async () => searchResultLayout(access.workspace.id, k.id, searchIdOrNotFound(String(query.search)), Number(query.layout)))().catch((error: unknown) => {
        if (error instanceof HttpError && error.status === 404) notFound();
        throw error;
      })
    : null;
  return (
    <KitEditor
      // A new store for each revision shown: the editor's history and document belong to one of them.
      key={`${k.id}@${data.library.viewing?.revision ?? "latest"}${fromSearch ? `@search-${String(query.search)}-${String(query.layout)}` : ""}`}
      init={{
        kit: {
          workspaceId: access.workspace.id,
          kitId: k.id,
          name: k.name,
          scale: k.scale,
          notes: k.notes,
          version: k.version,
          updatedByName: k.updatedByName,
          updatedAt: k.updatedAt,
          headRevision: k.headRevision,
        },
        layout: fromSearch ? fromSearch.layout : data.layout,
        ...(fromSearch ? { savedLayout: data.layout, note: fromSearch.note } : {}),
        readOnly: data.readOnly,
        lengthUnit: data.lengthUnit,
        // The page's analysis is of the saved layout: a search's layout is analysed in the browser.
        analysis: fromSearch ? null : data.analysis,
      }}
      library={{
        ...data.library,
        tags: k.tags,
        origin: k.originRevision !== null ? { kitId: k.originKitId, kitName: k.originKitName, revision: k.originRevision } : null,
      }}
      fromSearch={fromSearch ? { searchId: fromSearch.search.id, rank: Number(query.layout), searchedAt: fromSearch.search.createdAt, canWrite: !data.readOnly } : null}
    />
  );
}
