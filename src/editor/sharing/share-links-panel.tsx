"use client";
// The kit's share links, for its editors: make a read-only link to the head or to the revision shown,
// optionally expiring, with or without comments; copy it (its address is shown this once: only a hash is
// kept); see every link's state; revoke one (it answers 404 from the next request on).
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ErrorNotice } from "@/components/ui/notice";
import { SHARE_LABEL_MAX, type ShareLinkCreated, type ShareLinkRow } from "@/contracts/sharing";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { useKitLibrary } from "../library/library-context";
import { useEditor } from "../store/editor-context";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
const EXPIRY_CHOICES = [
  { value: "", label: "Never" },
  { value: "1", label: "In 1 day" },
  { value: "7", label: "In 7 days" },
  { value: "30", label: "In 30 days" },
] as const;

const errorText = (e: unknown) => (e instanceof ApiError && e.fields[0] ? `${e.fields[0].path}: ${e.fields[0].message}` : (e as Error).message);

function LinkState({ link }: { link: ShareLinkRow }) {
  if (link.state === "revoked") return <span className="rounded bg-ink/10 px-1">Revoked</span>;
  if (link.state === "expired") return <span className="rounded bg-ink/10 px-1">Expired</span>;
  return <span className="rounded bg-emerald-100 px-1 text-emerald-950">Active</span>;
}

export function ShareLinksPanel() {
  const kit = useEditor((s) => s.kit);
  const lib = useKitLibrary();
  const client = useQueryClient();
  const key = queryKeys.shareLinks(kit.workspaceId, kit.kitId);
  const base = `/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}/share-links`;
  const links = useQuery({ queryKey: key, queryFn: ({ signal }) => api<{ links: ShareLinkRow[] }>(base, { signal }) });
  const shownRevision = lib?.viewing?.revision ?? kit.headRevision ?? 1;
  const [target, setTarget] = useState<"head" | "pinned">(lib?.viewing ? "pinned" : "head");
  const [allowComments, setAllowComments] = useState(false);
  const [expires, setExpires] = useState("");
  const [label, setLabel] = useState("");
  const [made, setMade] = useState<{ url: string; copied: boolean } | null>(null);
  const ids = { label: useId(), expires: useId(), url: useId() };
  const create = useMutation({
    mutationFn: () =>
      api<ShareLinkCreated>(base, {
        method: "POST",
        body: { revision: target === "pinned" ? shownRevision : null, allowComments, expiresInDays: expires ? Number(expires) : null, ...(label.trim() ? { label: label.trim() } : {}) },
      }),
    onSuccess: (r) => {
      setMade({ url: `${window.location.origin}${r.path}`, copied: false });
      setLabel("");
      void client.invalidateQueries({ queryKey: key });
    },
  });
  const revoke = useMutation({
    mutationFn: (id: string) => api(`${base}/${id}`, { method: "DELETE" }),
    onSuccess: () => client.invalidateQueries({ queryKey: key }),
  });
  if (!lib?.canWrite) return <p className="text-sm text-ink-muted">Only the kit&apos;s editors make share links.</p>;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setMade(null);
    create.mutate();
  };
  const copy = async () => {
    if (!made) return;
    try {
      await navigator.clipboard.writeText(made.url);
      setMade({ ...made, copied: true });
    } catch {
      // No clipboard (an insecure origin): the address stays selected in its field to copy by hand.
    }
  };

  return (
    <section aria-label="Share links" className="flex flex-col gap-3" data-testid="share-links-panel">
      <form className="flex flex-col gap-2 rounded-md border border-ink/15 p-2" onSubmit={submit}>
        <h2 className="text-sm font-semibold">Make a read-only link</h2>
        <fieldset className="flex flex-col gap-0.5 text-sm">
          <legend className="text-xs font-medium">What it shows</legend>
          <label className="flex items-center gap-1.5"><input type="radio" name="share-target" checked={target === "head"} onChange={() => setTarget("head")} /> The latest revision, whichever it is when opened</label>
          <label className="flex items-center gap-1.5"><input type="radio" name="share-target" checked={target === "pinned"} onChange={() => setTarget("pinned")} /> Revision {shownRevision} only</label>
        </fieldset>
        <label className="flex items-center gap-1.5 text-sm"><input type="checkbox" checked={allowComments} onChange={(e) => setAllowComments(e.target.checked)} data-testid="share-allow-comments" /> Reviewers may comment (with a name they give)</label>
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <label htmlFor={ids.expires} className="text-xs font-medium">Expires</label>
          <select id={ids.expires} value={expires} onChange={(e) => setExpires(e.target.value)} className="rounded border border-ink/25 bg-white px-1 py-0.5 text-sm">
            {EXPIRY_CHOICES.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
          </select>
        </div>
        <div className="flex flex-col gap-0.5">
          <label htmlFor={ids.label} className="text-xs font-medium">Label (optional, for this list)</label>
          <input id={ids.label} value={label} maxLength={SHARE_LABEL_MAX} onChange={(e) => setLabel(e.target.value)} className="rounded border border-ink/25 px-1.5 py-1 text-sm" />
        </div>
        {create.error ? <p role="alert" className="text-xs text-red-700">{errorText(create.error)}</p> : null}
        <Button type="submit" busy={create.isPending} className="self-start px-2 py-1 text-xs" data-testid="share-create">Make the link</Button>
        {made ? (
          <div className="flex flex-col gap-1 rounded bg-emerald-50 p-2" role="status">
            <label htmlFor={ids.url} className="text-xs font-medium">The link (shown this once; anyone holding it can read the kit)</label>
            <div className="flex gap-1">
              <input id={ids.url} readOnly value={made.url} data-testid="share-url" onFocus={(e) => e.currentTarget.select()} className="min-w-0 flex-1 rounded border border-ink/25 bg-white px-1.5 py-1 text-xs" />
              <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={copy}>{made.copied ? "Copied" : "Copy"}</Button>
            </div>
          </div>
        ) : null}
      </form>
      <div className="flex flex-col gap-1.5">
        <h2 className="text-sm font-semibold">Links to this kit</h2>
        {links.isPending ? <Spinner label="Loading links…" /> : null}
        {links.error ? <ErrorNotice title="The links could not be loaded" message={errorText(links.error)} onRetry={() => void links.refetch()} /> : null}
        {links.data && links.data.links.length === 0 ? <p className="text-sm text-ink-muted">No share links yet.</p> : null}
        {revoke.error ? <p role="alert" className="text-xs text-red-700">{errorText(revoke.error)}</p> : null}
        <ul className="flex flex-col gap-1.5">
          {links.data?.links.map((l) => (
            <li key={l.id} data-testid="share-link-row" className="flex flex-wrap items-center gap-x-2 gap-y-0.5 rounded border border-ink/10 p-1.5 text-xs">
              <LinkState link={l} />
              <span className="font-medium">{l.label || (l.revision === null ? "Latest revision" : `Revision ${l.revision}`)}</span>
              <span className="text-ink-muted">
                {l.revision === null ? "latest" : `revision ${l.revision}`} · {l.allowComments ? "comments allowed" : "read only"} · {l.expiresAt ? `expires ${when.format(new Date(l.expiresAt))}` : "no expiry"} · by {l.createdByName ?? "someone no longer here"}
              </span>
              {l.state === "active" ? (
                <Button variant="ghost" className="ml-auto px-1.5 py-0 text-xs" busy={revoke.isPending && revoke.variables === l.id} onClick={() => revoke.mutate(l.id)} aria-label={`Revoke the link ${l.label || (l.revision === null ? "to the latest revision" : `to revision ${l.revision}`)}`}>
                  Revoke
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}
