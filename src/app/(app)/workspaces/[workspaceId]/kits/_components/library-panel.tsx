"use client";
// The design library: every kit of the workspace in a table the server filters, sorts and pages, with the
// key readouts judged against the targets. The view (filters, sort, page, columns) is the page URL; picking
// two to four kits opens them side by side.
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { RowSelectionState } from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { EmptyState, ErrorNotice } from "@/components/ui/notice";
import { compareHref, COMPARE_MAX, COMPARE_MIN } from "@/contracts/compare";
import { LIBRARY_PAGE_SIZES, type LibraryFacets, type LibraryPage } from "@/contracts/library";
import { READOUT_KEYS, READOUT_LABELS, targetText } from "@/contracts/targets";
import { api } from "@/lib/api-client";
import { LIBRARY_COLUMNS, libraryApiSearch, libraryViewSearch, readLibraryView, withView, type LibraryView } from "@/lib/library-url";
import { queryKeys } from "@/lib/query-keys";
import { CreateKitForm } from "./create-kit-form";
import { LibraryFilters } from "./library-filters";
import { COLUMN_LABELS, LibraryTable } from "./library-table";

const number = new Intl.NumberFormat("en-GB");

function ColumnChooser({ view, onChange }: { view: LibraryView; onChange: (c: Partial<LibraryView>) => void }) {
  return (
    <details className="relative">
      <summary className="cursor-pointer rounded-md border border-ink/20 bg-white px-2 py-1 text-sm" data-testid="library-columns">Columns</summary>
      <fieldset className="absolute right-0 z-20 mt-1 w-56 rounded-md border border-ink/20 bg-white p-2 shadow-lg">
        <legend className="sr-only">Columns shown</legend>
        {LIBRARY_COLUMNS.filter((c) => c !== "name").map((c) => (
          <label key={c} className="flex items-center gap-2 py-0.5 text-sm">
            <input
              type="checkbox"
              checked={view.cols.includes(c)}
              onChange={(e) => onChange({ cols: e.target.checked ? LIBRARY_COLUMNS.filter((x) => x === c || view.cols.includes(x)) : view.cols.filter((x) => x !== c) })}
            />
            {COLUMN_LABELS[c]}
          </label>
        ))}
      </fieldset>
    </details>
  );
}

function Pager({ page, view, onChange }: { page: LibraryPage; view: LibraryView; onChange: (c: Partial<LibraryView>) => void }) {
  const pages = Math.max(1, Math.ceil(page.total / page.size));
  const first = page.total === 0 ? 0 : (page.page - 1) * page.size + 1;
  const last = Math.min(page.total, page.page * page.size);
  return (
    <nav aria-label="Pages of kits" className="flex flex-wrap items-center justify-between gap-2 text-sm">
      <p className="text-ink-muted" data-testid="library-count">
        {page.total === 0 ? "No kits" : `${number.format(first)}–${number.format(last)} of ${number.format(page.total)} kits`}
      </p>
      <div className="flex items-center gap-2">
        <label className="flex items-center gap-1 text-xs">
          Rows per page
          <select value={view.size} onChange={(e) => onChange({ size: Number(e.target.value) })} className="rounded border border-ink/20 bg-white px-1 py-0.5">
            {LIBRARY_PAGE_SIZES.map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
        </label>
        <Button variant="secondary" disabled={page.page <= 1} onClick={() => onChange({ page: page.page - 1 })}>Previous</Button>
        <span className="tabular-nums">Page {page.page} of {number.format(pages)}</span>
        <Button variant="secondary" disabled={page.page >= pages} onClick={() => onChange({ page: page.page + 1 })}>Next</Button>
      </div>
    </nav>
  );
}

export function LibraryPanel({ workspaceId, workspaceName, canWrite }: { workspaceId: string; workspaceName: string; canWrite: boolean }) {
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const view = useMemo(() => readLibraryView(new URLSearchParams(params.toString())), [params]);
  const setView = useCallback(
    (change: Partial<LibraryView>) => {
      const search = libraryViewSearch(withView(view, change));
      router.replace(search ? `${pathname}?${search}` : pathname, { scroll: false });
    },
    [view, router, pathname],
  );
  const apiSearch = libraryApiSearch(view);
  const library = useQuery({
    queryKey: queryKeys.library(workspaceId, apiSearch),
    queryFn: ({ signal }) => api<LibraryPage>(`/api/workspaces/${workspaceId}/kits${apiSearch ? `?${apiSearch}` : ""}`, { signal }),
    placeholderData: keepPreviousData,
  });
  const facets = useQuery({
    queryKey: queryKeys.facets(workspaceId),
    queryFn: ({ signal }) => api<LibraryFacets>(`/api/workspaces/${workspaceId}/kits/facets`, { signal }),
  });
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [creating, setCreating] = useState(false);
  const picked = Object.keys(selection).filter((id) => selection[id]);
  const data = library.data;
  const filtered = apiSearch.replace(/(^|&)(sort|dir|page|size)=[^&]*/g, "") !== "";

  return (
    <div data-wide className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center gap-3">
        <h1 id="kits-heading" className="mr-auto text-xl font-semibold">Kits <span className="font-normal text-ink-muted">in {workspaceName}</span></h1>
        {library.isFetching && !library.isPending ? <Spinner label="Refreshing" /> : null}
        {picked.length > 0 ? (
          <p className="text-sm text-ink-muted" role="status">{picked.length} of {COMPARE_MAX} picked</p>
        ) : null}
        {picked.length >= COMPARE_MIN ? (
          <Link
            href={compareHref(workspaceId, picked.map((kitId) => ({ kitId, revision: null })))}
            className="rounded-md bg-steel px-3 py-1.5 text-sm font-medium text-white hover:bg-[#2f4a60]"
            data-testid="compare-picked"
          >
            Compare {picked.length} kits
          </Link>
        ) : (
          <span className="text-xs text-ink-muted">Pick {COMPARE_MIN}–{COMPARE_MAX} kits to compare them</span>
        )}
        {picked.length ? <Button variant="ghost" onClick={() => setSelection({})}>Clear picks</Button> : null}
        <ColumnChooser view={view} onChange={setView} />
        {canWrite ? <Button onClick={() => setCreating(true)} data-testid="new-kit">New kit</Button> : null}
      </div>
      <LibraryFilters view={view} facets={facets.data} onChange={setView} />
      {data ? (
        <p className="text-xs text-ink-muted">
          Readouts are marked against the workspace&apos;s <Link href={`/workspaces/${workspaceId}/targets`} className="text-steel underline">targets</Link>
          {" "}({READOUT_KEYS.map((k) => `${READOUT_LABELS[k].label.toLowerCase()} ${targetText(k, data.targets)}`).join(", ")}); a kit may set its own. ✓ meets, ✗ misses.
        </p>
      ) : null}
      {library.isPending ? (
        <div className="rounded-lg border border-ink/10 bg-white p-6 text-sm text-ink-muted"><Spinner label="Loading kits…" /></div>
      ) : library.isError ? (
        <ErrorNotice title="Could not load the kits" message={library.error.message} onRetry={() => library.refetch()} />
      ) : data!.total === 0 && !filtered && view.status === "active" ? (
        <EmptyState title="No kits yet">
          {canWrite ? "Create the first one with New kit." : "Nobody in this workspace has created a kit yet."}
        </EmptyState>
      ) : (
        <>
          {data!.kits.length === 0 ? (
            <EmptyState title="No kits match">Change or clear the filters to see more.</EmptyState>
          ) : (
            <LibraryTable
              workspaceId={workspaceId}
              kits={data!.kits}
              targets={data!.targets}
              canWrite={canWrite}
              sort={view.sort}
              dir={view.dir}
              columns={view.cols}
              selection={selection}
              onSort={(sort, dir) => setView({ sort, dir })}
              onSelection={setSelection}
              busy={library.isFetching}
            />
          )}
          <Pager page={data!} view={view} onChange={setView} />
        </>
      )}
      {!canWrite ? <p className="text-sm text-ink-muted">You can read this workspace&apos;s kits. Ask an admin for the editor role to create or change them.</p> : null}
      <ModalDialog open={creating} title="New kit" onClose={() => setCreating(false)} testId="new-kit-dialog">
        <CreateKitForm workspaceId={workspaceId} onCreated={() => setCreating(false)} />
      </ModalDialog>
    </div>
  );
}
