"use client";
// The design search page: the question (editors), the search shown (progress while it runs, with the best
// so far and a cancel; its answer once done), and the kit's earlier searches.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { EmptyState, ErrorNotice } from "@/components/ui/notice";
import { PREFERENCE_LABELS, type SearchQuestion, type SearchView } from "@/contracts/design-search";
import type { Targets } from "@/contracts/targets";
import { api, ApiError, type FieldIssue } from "@/lib/api-client";
import { SearchAnswerView } from "./search-answer";
import { SearchForm } from "./search-form";

export type FigureOffer =
  | { kind: "number"; key: string; label: string; unit: "mm" | "°"; limit: [number, number]; current: number }
  | { kind: "choice"; key: string; label: string; options: string[]; current: string };

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
const STATUS_WORDS: Record<SearchView["status"], string> = { running: "running", done: "done", cancelled: "cancelled", failed: "failed" };

export function SearchPanel(props: {
  workspaceId: string;
  kitId: string;
  headRevision: number;
  figures: FigureOffer[];
  aims: Targets;
  canStart: boolean;
  searches: SearchView[];
  initialSearchId: string | null;
}) {
  const { workspaceId, kitId, canStart } = props;
  const base = `/api/workspaces/${workspaceId}/kits/${kitId}/searches`;
  const client = useQueryClient();
  const [shownId, setShownId] = useState<string | null>(props.initialSearchId);
  const list = useQuery({
    queryKey: ["searches", kitId],
    queryFn: () => api<{ searches: SearchView[] }>(base).then((r) => r.searches),
    initialData: props.searches,
    // While one runs, its row's count and status follow it.
    refetchInterval: (q) => (q.state.data?.some((x) => x.status === "running") ? 2000 : false),
  });
  const shown = useQuery({
    queryKey: ["search", shownId],
    queryFn: () => api<{ search: SearchView }>(`${base}/${shownId}`).then((r) => r.search),
    enabled: shownId !== null,
    // Progress comes from the database as the workers record each batch.
    refetchInterval: (q) => (q.state.data?.status === "running" ? 400 : false),
  });
  const start = useMutation({
    mutationFn: (q: SearchQuestion) => api<{ search: SearchView }>(base, { method: "POST", body: q }).then((r) => r.search),
    onSuccess: (s) => {
      client.setQueryData(["search", s.id], s);
      setShownId(s.id);
      void client.invalidateQueries({ queryKey: ["searches", kitId] });
    },
  });
  const cancel = useMutation({
    mutationFn: (id: string) => api<{ search: SearchView }>(`${base}/${id}/cancel`, { method: "POST" }).then((r) => r.search),
    onSuccess: (s) => {
      client.setQueryData(["search", s.id], s);
      void client.invalidateQueries({ queryKey: ["searches", kitId] });
    },
  });
  const startErrors: FieldIssue[] = start.error instanceof ApiError ? start.error.fields : [];
  const s = shown.data;

  return (
    <div className="flex flex-col gap-6">
      {canStart ? (
        <section aria-labelledby="search-question-heading" className="flex flex-col gap-2">
          <h2 id="search-question-heading" className="text-lg font-semibold">A new search from revision {props.headRevision}</h2>
          <SearchForm figures={props.figures} aims={props.aims} busy={start.isPending} errors={startErrors} onStart={(q) => start.mutate(q)} />
          {start.isError ? <ErrorNotice title="The search did not start" message={start.error.message} /> : null}
        </section>
      ) : (
        <p className="text-sm text-ink-muted">Viewers read the searches of this kit; an editor starts them.</p>
      )}

      <section aria-labelledby="search-shown-heading" className="flex flex-col gap-3">
        <h2 id="search-shown-heading" className="text-lg font-semibold">{s ? `Search of ${when.format(new Date(s.createdAt))}` : "Search"}</h2>
        {shownId === null ? (
          <EmptyState title="No search yet">{canStart ? "Pick what may move and the aims above, then start the search." : "No one has searched from this kit yet."}</EmptyState>
        ) : shown.isPending ? (
          <Spinner label="Loading the search" />
        ) : shown.isError ? (
          <ErrorNotice title="The search could not be read" message={shown.error.message} onRetry={() => void shown.refetch()} />
        ) : s ? (
          <>
            <SearchProgress search={s} onCancel={canStart && s.status === "running" ? () => cancel.mutate(s.id) : undefined} cancelling={cancel.isPending} />
            {cancel.isError ? <ErrorNotice title="The search could not be cancelled" message={cancel.error.message} /> : null}
            {s.status === "failed" ? <ErrorNotice title="The search failed" message={s.error ?? "A batch kept failing."} /> : null}
            {s.answer ? <SearchAnswerView search={s} workspaceId={workspaceId} /> : null}
          </>
        ) : null}
      </section>

      {list.data.length > 0 ? (
        <section aria-labelledby="search-list-heading" className="flex flex-col gap-2">
          <h2 id="search-list-heading" className="text-lg font-semibold">Searches of this kit</h2>
          <ul className="flex flex-col divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white text-sm">
            {list.data.map((x) => (
              <li key={x.id} className="flex flex-wrap items-center gap-x-3 px-3 py-1.5">
                <button type="button" className="text-steel underline" aria-current={x.id === shownId ? "true" : undefined} onClick={() => setShownId(x.id)}>
                  {when.format(new Date(x.createdAt))}
                </button>
                <span>{STATUS_WORDS[x.status]}</span>
                <span className="text-ink-muted">
                  {x.question.moves.length} figure{x.question.moves.length === 1 ? "" : "s"} free · lock ≥ {x.question.aims.minLockDeg}°, SF ≥ {x.question.aims.minSafetyFactor} · {PREFERENCE_LABELS[x.question.prefer].toLowerCase()} · {x.tried} tried · by {x.createdByName ?? "someone no longer here"}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

function SearchProgress({ search, onCancel, cancelling }: { search: SearchView; onCancel?: () => void; cancelling: boolean }) {
  const pct = Math.min(100, Math.round((100 * search.tried) / Math.max(1, search.planned)));
  const best = search.best;
  const phase = search.phase === "sample" ? "sampling the space" : search.phase === "refine" ? "refining around the best" : "finished";
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-ink/10 bg-white p-3" data-testid="search-progress" data-status={search.status}>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span id="search-progress-label" className="font-medium">
          {search.status === "running" ? `Running: ${phase}` : search.status === "done" ? "Done" : search.status === "cancelled" ? "Cancelled" : "Failed"}
        </span>
        <span data-testid="search-tried">
          {search.tried} of {search.planned} layouts tried
        </span>
        {onCancel ? (
          <Button variant="secondary" className="ml-auto px-2 py-0.5 text-xs" busy={cancelling} onClick={onCancel} data-testid="cancel-search">
            Cancel the search
          </Button>
        ) : null}
      </div>
      <div role="progressbar" aria-labelledby="search-progress-label" aria-valuemin={0} aria-valuemax={search.planned} aria-valuenow={search.tried} aria-valuetext={`${search.tried} of ${search.planned} layouts tried`} className="h-3 overflow-hidden rounded bg-paper" data-testid="search-progress-bar">
        <div className="h-full bg-steel transition-[width]" style={{ width: `${pct}%` }} />
      </div>
      <p className="text-sm" data-testid="search-best-so-far">
        {best
          ? `Best so far: ${best.readouts.lockDeg?.toFixed(1) ?? "—"}° lock at safety factor ${best.readouts.safetyFactor?.toFixed(2) ?? "—"}${best.violation === 0 ? ", meeting every aim" : ", short of the aims"}.`
          : "No layout analysed yet."}
      </p>
    </div>
  );
}
