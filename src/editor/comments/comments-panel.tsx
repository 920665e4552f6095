"use client";
// The comments beside the drawing: the threads of the revision shown, numbered as their markers are; a new
// comment pinned to a point picked on a view; reply, resolve, reopen and delete where allowed. Bodies and
// names are rendered as React text (never as HTML), line breaks kept.
import { useEffect, useId, useRef, useState, type FormEvent } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ErrorNotice } from "@/components/ui/notice";
import { COMMENT_BODY_MAX, DISPLAY_NAME_MAX, type CommentRow, type CommentThread } from "@/contracts/sharing";
import { ApiError } from "@/lib/api-client";
import { useComments, type CommentsState } from "./comments-context";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
const VIEW_NAMES = { front: "Front view", top: "Top view", joint: "Joint section" } as const;
const NAME_KEY = "knucklebench.reviewer-name";

function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.fields[0] ? `${error.fields[0].path}: ${error.fields[0].message}` : error.message;
  return (error as Error).message;
}

/** The reviewer's display name (a share link): remembered in this browser only. */
function useReviewerName(): [string, (v: string) => void] {
  const [name, setName] = useState("");
  useEffect(() => {
    // Read after mount: the server has no such storage, and the first render must match it.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setName(window.localStorage.getItem(NAME_KEY) ?? "");
  }, []);
  return [name, (v) => {
    setName(v);
    window.localStorage.setItem(NAME_KEY, v);
  }];
}

function CommentForm({ c, submitLabel, onSubmit, onCancel, testId }: { c: CommentsState; submitLabel: string; onSubmit: (body: Record<string, unknown>) => Promise<unknown>; onCancel?: () => void; testId: string }) {
  const [body, setBody] = useState("");
  const [name, setName] = useReviewerName();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const bodyId = useId();
  const nameId = useId();
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      await onSubmit({ body, ...(c.source.needsName ? { authorName: name } : {}) });
      setBody("");
    } catch (err) {
      setError(messageOf(err));
    } finally {
      setBusy(false);
    }
  };
  return (
    <form className="flex flex-col gap-1.5" onSubmit={submit} data-testid={testId}>
      {c.source.needsName ? (
        <div className="flex flex-col gap-0.5">
          <label htmlFor={nameId} className="text-xs font-medium">Your name</label>
          <input id={nameId} value={name} maxLength={DISPLAY_NAME_MAX} required autoComplete="name" onChange={(e) => setName(e.target.value)} className="rounded border border-ink/25 px-1.5 py-1 text-sm" />
        </div>
      ) : null}
      <label htmlFor={bodyId} className="sr-only">{submitLabel}</label>
      <textarea id={bodyId} value={body} maxLength={COMMENT_BODY_MAX} required rows={3} placeholder="Write a comment" onChange={(e) => setBody(e.target.value)} className="rounded border border-ink/25 px-1.5 py-1 text-sm" />
      {error ? <p role="alert" className="text-xs text-red-700">{error}</p> : null}
      <div className="flex gap-1.5">
        <Button type="submit" busy={busy} className="px-2 py-1 text-xs">{submitLabel}</Button>
        {onCancel ? <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={onCancel}>Cancel</Button> : null}
      </div>
    </form>
  );
}

function CommentBody({ row }: { row: CommentRow }) {
  return (
    <div>
      <p className="text-xs text-ink-muted">
        <span className="font-medium text-ink">{row.authorName}</span>
        {row.viaShareLink ? " (share link)" : ""} · <time dateTime={row.createdAt}>{when.format(new Date(row.createdAt))}</time>
      </p>
      <p className="whitespace-pre-wrap break-words text-sm" data-testid="comment-body">{row.body}</p>
    </div>
  );
}

function Thread({ c, t }: { c: CommentsState; t: CommentThread }) {
  const [replying, setReplying] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const ref = useRef<HTMLLIElement>(null);
  const n = c.numberOf(t.id);
  const selected = c.selected === t.id;
  useEffect(() => {
    if (selected) ref.current?.scrollIntoView({ block: "nearest" });
  }, [selected]);
  const act = (run: () => Promise<unknown>) => () => {
    setError(null);
    run().catch((err: unknown) => setError(messageOf(err)));
  };
  return (
    <li ref={ref} data-testid="comment-thread" data-comment-number={n} className={`rounded-md border p-2 ${selected ? "border-amber-700 bg-amber-50" : "border-ink/15"} ${t.resolvedAt ? "opacity-90" : ""}`}>
      <div className="mb-1 flex items-center gap-2 text-xs">
        <button type="button" className="rounded-full border border-amber-800 bg-amber-100 px-1.5 font-semibold" aria-label={`Comment ${n}: show on the ${VIEW_NAMES[t.view].toLowerCase()}`} onClick={() => c.select(selected ? null : t.id)}>{n}</button>
        <span className="text-ink-muted">{VIEW_NAMES[t.view]}</span>
        {t.resolvedAt ? <span className="rounded bg-ink/10 px-1">Resolved{t.resolvedByName ? ` by ${t.resolvedByName}` : ""}</span> : null}
      </div>
      <CommentBody row={t} />
      {t.replies.length > 0 ? (
        <ul className="mt-1.5 flex flex-col gap-1.5 border-l-2 border-ink/10 pl-2" aria-label={`Replies to comment ${n}`}>
          {t.replies.map((r) => (
            <li key={r.id} className="flex items-start gap-1">
              <div className="min-w-0 flex-1"><CommentBody row={r} /></div>
              {r.canDelete && c.source.itemUrl ? <Button variant="ghost" className="px-1 py-0 text-xs" aria-label={`Delete the reply by ${r.authorName}`} onClick={act(() => c.remove(r.id))}>Delete</Button> : null}
            </li>
          ))}
        </ul>
      ) : null}
      {error ? <p role="alert" className="mt-1 text-xs text-red-700">{error}</p> : null}
      <div className="mt-1.5 flex flex-wrap gap-1">
        {replying ? null : <Button variant="secondary" className="px-2 py-0.5 text-xs" onClick={() => setReplying(true)}>Reply</Button>}
        {c.source.itemUrl ? (
          <Button variant="secondary" className="px-2 py-0.5 text-xs" onClick={act(() => c.setResolved(t.id, !t.resolvedAt))}>{t.resolvedAt ? "Reopen" : "Resolve"}</Button>
        ) : null}
        {t.canDelete && c.source.itemUrl ? <Button variant="ghost" className="px-2 py-0.5 text-xs" aria-label={`Delete comment ${n} and its replies`} onClick={act(() => c.remove(t.id))}>Delete</Button> : null}
      </div>
      {replying ? (
        <div className="mt-1.5">
          <CommentForm c={c} submitLabel="Reply" testId="reply-form" onCancel={() => setReplying(false)} onSubmit={async (b) => { await c.post({ ...b, parentId: t.id }); setReplying(false); }} />
        </div>
      ) : null}
    </li>
  );
}

export function CommentsPanel() {
  const c = useComments();
  if (!c) return null;
  const shown = c.threads.filter((t) => c.showResolved || t.resolvedAt === null);
  const resolvedCount = c.threads.length - c.threads.filter((t) => t.resolvedAt === null).length;
  return (
    <section aria-label="Comments" className="flex flex-col gap-2" data-testid="comments-panel">
      <div className="flex flex-wrap items-center gap-2">
        <h2 className="mr-auto text-sm font-semibold">Comments on revision {c.revision}</h2>
        <Button className="px-2 py-1 text-xs" data-testid="add-comment" disabled={c.picking} onClick={() => { c.setPending(null); c.setPicking(true); }}>
          {c.picking ? "Click a point on a view…" : "Add a comment"}
        </Button>
      </div>
      {c.picking ? <p className="text-xs text-ink-muted">Click the point on the front view, the top view or the joint section (or use a view&apos;s “Pin at the centre”). <button type="button" className="underline" onClick={() => c.setPicking(false)}>Stop</button></p> : null}
      {c.pending ? (
        <div className="rounded-md border border-blue-800/40 bg-blue-50 p-2">
          <p className="mb-1 text-xs">New comment on the {VIEW_NAMES[c.pending.view].toLowerCase()}, at ({c.pending.xMm.toFixed(1)}, {c.pending.yMm.toFixed(1)}) mm</p>
          <CommentForm
            c={c}
            submitLabel="Post comment"
            testId="new-comment-form"
            onCancel={() => c.setPending(null)}
            onSubmit={async (b) => {
              const made = await c.post({ ...b, revision: c.revision, view: c.pending!.view, xMm: c.pending!.xMm, yMm: c.pending!.yMm });
              c.setPending(null);
              c.select(made.id);
            }}
          />
        </div>
      ) : null}
      {resolvedCount > 0 ? (
        <label className="flex items-center gap-1.5 text-xs">
          <input type="checkbox" checked={c.showResolved} onChange={(e) => c.setShowResolved(e.target.checked)} />
          Show resolved ({resolvedCount})
        </label>
      ) : null}
      {c.status === "pending" ? <Spinner label="Loading comments…" /> : null}
      {c.status === "error" ? <ErrorNotice title="Comments could not be loaded" message={messageOf(c.error)} /> : null}
      {c.status === "success" && shown.length === 0 ? (
        <p className="text-sm text-ink-muted" data-testid="comments-empty">
          {c.threads.length === 0 ? "No comments on this revision yet. Add one to pin a remark to a point of the drawing." : "Every comment here is resolved."}
        </p>
      ) : null}
      <ol className="flex flex-col gap-2" aria-label="Comment threads">
        {shown.map((t) => <Thread key={t.id} c={c} t={t} />)}
      </ol>
    </section>
  );
}
