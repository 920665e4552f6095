"use client";
// The comparison's dimension sheets: one PDF with every item's sheet (GET …/compare/sheet.pdf with the
// page's own items), or the sheet of one item (its kit's sheet.pdf pinned to the revision compared), with
// the kit sheet's paper, orientation and unit, and the shared export job's progress while a sheet is made.
import { Button } from "@/components/ui/button";
import { compareItemText, type ComparedItem } from "@/contracts/compare";
import type { LengthUnit } from "@/figures/length-unit";
import { ExportJobStatus, useExportJob } from "../exports/export-job";
import { SheetChoiceFields, sheetParams, useSheetChoices } from "../exports/sheet-choices";
import { itemLetter } from "./overlay-view";

type Item = Pick<ComparedItem, "kitId" | "kitName" | "revision" | "isHead">;

/** The compare page's items as it names them: a head as the kit alone, an earlier revision as kit@n. */
export const compareItemsParam = (items: readonly Item[]) => items.map((it) => compareItemText({ kitId: it.kitId, revision: it.isHead ? null : it.revision })).join(",");

export function CompareSheets({ workspaceId, items, lengthUnit }: { workspaceId: string; items: readonly Item[]; lengthUnit: LengthUnit }) {
  const [choices, setChoices] = useSheetChoices(lengthUnit);
  const exportJob = useExportJob();
  const params = sheetParams(choices);

  const combined = () =>
    exportJob.start({
      url: `/api/workspaces/${workspaceId}/compare/sheet.pdf?${new URLSearchParams({ items: compareItemsParam(items), ...params })}`,
      label: `Making the combined sheet of ${items.length} kits…`,
      fallbackName: "compare-sheet.pdf",
    });
  const single = (it: Item, i: number) =>
    exportJob.start({
      // Pinned to the revision compared, so the sheet is the one on this page even if the kit is saved again.
      url: `/api/workspaces/${workspaceId}/kits/${it.kitId}/exports/sheet.pdf?${new URLSearchParams({ ...params, revision: String(it.revision) })}`,
      label: `Making the sheet of ${itemLetter(i)}…`,
      fallbackName: "sheet.pdf",
    });

  return (
    <section aria-labelledby="compare-sheets" className="flex flex-col gap-2 rounded-lg border border-ink/10 bg-white p-3 text-sm" data-testid="compare-sheets">
      <h2 id="compare-sheets" className="text-sm font-semibold">Dimension sheets</h2>
      <SheetChoiceFields value={choices} onChange={setChoices} withUnit />
      <div className="flex flex-wrap items-center gap-2">
        <Button data-testid="compare-sheet-combined" disabled={exportJob.busy} onClick={() => void combined()}>
          One PDF of all {items.length}
        </Button>
        <span className="text-ink-muted">or one item&apos;s:</span>
        {items.map((it, i) => (
          <Button
            key={i}
            variant="secondary"
            disabled={exportJob.busy}
            data-testid={`compare-sheet-${itemLetter(i)}`}
            aria-label={`Sheet of ${itemLetter(i)}: ${it.kitName}, revision ${it.revision}`}
            onClick={() => void single(it, i)}
          >
            {itemLetter(i)}
          </Button>
        ))}
      </div>
      <ExportJobStatus state={exportJob} testId="compare-sheet-status" />
    </section>
  );
}
