"use client";
// Above the editor when an earlier revision is shown: which one, that it is read-only, and the ways on
// (back to the latest, compare with it, restore it, make a variant of it).
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { compareHref } from "@/contracts/compare";
import { useEditor } from "../store/editor-context";
import { RestoreDialog } from "./history-panel";
import { useKitLibrary } from "./library-context";
import { VariantDialog } from "./variant-dialog";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function RevisionBanner() {
  const kit = useEditor((s) => s.kit);
  const lib = useKitLibrary();
  const [variant, setVariant] = useState(false);
  const [restoring, setRestoring] = useState(false);
  if (!lib?.viewing) return null;
  const v = lib.viewing;
  return (
    <div role="note" data-testid="revision-banner" className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-amber-300 bg-amber-50 px-3 py-1.5 text-sm text-amber-950">
      <p className="mr-auto">
        <strong>Revision {v.revision}</strong> of {kit.headRevision ?? "?"}, read-only · {v.authorName ?? "someone no longer here"}, {when.format(new Date(v.createdAt))}
        {v.note ? <> · “{v.note}”</> : null}
      </p>
      <Link className="underline" href={`/workspaces/${kit.workspaceId}/kits/${kit.kitId}`}>Back to the latest</Link>
      <Link className="underline" href={compareHref(kit.workspaceId, [{ kitId: kit.kitId, revision: v.revision }, { kitId: kit.kitId, revision: null }])}>Compare with the latest</Link>
      {lib.canWrite ? (
        <>
          <Button variant="secondary" className="px-2 py-0.5 text-xs" onClick={() => setRestoring(true)}>Restore as the latest</Button>
          <Button variant="secondary" className="px-2 py-0.5 text-xs" onClick={() => setVariant(true)}>Make a variant</Button>
        </>
      ) : null}
      <RestoreDialog revision={restoring ? { number: v.revision } : null} onClose={() => setRestoring(false)} />
      {variant ? <VariantDialog open onClose={() => setVariant(false)} workspaceId={kit.workspaceId} kitId={kit.kitId} kitName={kit.name} revision={v.revision} /> : null}
    </div>
  );
}
