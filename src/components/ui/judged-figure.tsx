// A readout judged against its target: the figure, a mark that does not rely on colour alone (✓ meets,
// ✗ misses), and the target in words for screen readers and on hover.
import { READOUT_LABELS, judgeReadout, targetText, type ReadoutKey, type Targets, type Verdict } from "@/contracts/targets";
import { fmt } from "@/figures/format";

export const VERDICT_TONE: Record<Verdict, string> = { meets: "text-emerald-800", misses: "text-red-700", none: "text-ink" };

export function readoutText(key: ReadoutKey, value: number | null): string {
  const { unit, digits } = READOUT_LABELS[key];
  return fmt(value, digits, unit);
}

export function JudgedFigure({ readout, value, targets, className = "" }: { readout: ReadoutKey; value: number | null; targets: Targets; className?: string }) {
  const verdict = judgeReadout(readout, value, targets);
  const target = targetText(readout, targets);
  const words = verdict === "meets" ? `meets the target ${target}` : verdict === "misses" ? `misses the target ${target}` : "";
  return (
    <span data-verdict={verdict} title={words || undefined} className={`inline-flex items-baseline gap-1 tabular-nums ${VERDICT_TONE[verdict]} ${className}`}>
      {readoutText(readout, value)}
      {verdict === "none" ? null : <span aria-hidden className="text-xs font-semibold">{verdict === "meets" ? "✓" : "✗"}</span>}
      {words ? <span className="sr-only">, {words}</span> : null}
    </span>
  );
}
