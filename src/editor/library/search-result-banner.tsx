"use client";
// Above the editor when it opened a design search's layout: the document is that layout, not yet saved.
// Save keeps it as the kit's next revision (its note names the search); or keep it as a new kit beside this one.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { saveAsNewKit } from "../save/save-actions";
import { useEditor, useEditorStore } from "../store/editor-context";

export interface SearchResultOrigin {
  readonly searchId: string;
  readonly rank: number;
  readonly searchedAt: string;
  readonly canWrite: boolean;
}

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function SearchResultBanner({ origin }: { origin: SearchResultOrigin | null }) {
  const store = useEditorStore();
  const router = useRouter();
  const kit = useEditor((s) => s.kit);
  const unsaved = useEditor((s) => JSON.stringify(s.layout) !== s.savedJson);
  const [busy, setBusy] = useState(false);
  if (!origin) return null;
  return (
    <div role="note" data-testid="search-result-banner" className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-steel/30 bg-steel/5 px-3 py-1.5 text-sm text-ink">
      <p className="mr-auto">
        <strong>Layout {origin.rank}</strong> of the design search of {when.format(new Date(origin.searchedAt))}
        {unsaved ? ", not saved yet: Save keeps it as this kit's next revision, with a note of the search." : ", saved."}
      </p>
      <Link className="underline" href={`/workspaces/${kit.workspaceId}/kits/${kit.kitId}/search?search=${origin.searchId}`}>Back to the search</Link>
      {origin.canWrite && unsaved ? (
        <Button
          variant="secondary"
          className="px-2 py-0.5 text-xs"
          busy={busy}
          data-testid="save-search-result-as-kit"
          onClick={async () => {
            setBusy(true);
            const id = await saveAsNewKit(store, ` (search layout ${origin.rank})`);
            setBusy(false);
            if (id) router.push(`/workspaces/${kit.workspaceId}/kits/${id}`);
          }}
        >
          Save as a new kit
        </Button>
      ) : null}
    </div>
  );
}
