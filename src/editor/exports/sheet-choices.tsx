"use client";
// The dimension sheet's choices — paper and orientation, and where the page has no unit of its own, the
// unit its lengths show in — as the editor's Export menu and the compare page both offer them.
import { useId, useState } from "react";
import type { Orientation, PaperSize } from "@/contracts/exports";
import type { LengthUnit } from "@/figures/length-unit";

export interface SheetChoices {
  readonly paper: PaperSize;
  readonly orientation: Orientation;
  readonly unit: LengthUnit;
}

/** The choices' state, starting from the person's unit (Letter for inches, A4 for millimetres). */
export function useSheetChoices(unit: LengthUnit) {
  return useState<SheetChoices>({ paper: unit === "in" ? "letter" : "a4", orientation: "portrait", unit });
}

const SELECT = "rounded border border-ink/20 bg-white px-1 py-0.5";

export function SheetChoiceFields({ value, onChange, withUnit = false }: { value: SheetChoices; onChange: (next: SheetChoices) => void; withUnit?: boolean }) {
  const paperId = useId();
  const orientationId = useId();
  const unitId = useId();
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={paperId}>Paper</label>
      <select id={paperId} value={value.paper} onChange={(e) => onChange({ ...value, paper: e.target.value as PaperSize })} className={SELECT}>
        <option value="a4">A4</option>
        <option value="letter">Letter</option>
      </select>
      <label htmlFor={orientationId}>Orientation</label>
      <select id={orientationId} value={value.orientation} onChange={(e) => onChange({ ...value, orientation: e.target.value as Orientation })} className={SELECT}>
        <option value="portrait">portrait</option>
        <option value="landscape">landscape</option>
      </select>
      {withUnit ? (
        <>
          <label htmlFor={unitId}>Lengths in</label>
          <select id={unitId} value={value.unit} onChange={(e) => onChange({ ...value, unit: e.target.value as LengthUnit })} className={SELECT}>
            <option value="mm">millimetres</option>
            <option value="in">inches</option>
          </select>
        </>
      ) : null}
    </div>
  );
}

/** The sheet's query parameters. */
export const sheetParams = (c: SheetChoices): Record<string, string> => ({ paper: c.paper, orientation: c.orientation, unit: c.unit });
