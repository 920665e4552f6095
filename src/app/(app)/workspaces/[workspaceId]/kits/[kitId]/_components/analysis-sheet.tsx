"use client";
import { ExplainedLabel, methodHref } from "@/components/ui/explained-label";
import type { AnalysisResult } from "@/engine";
import { citationByKey } from "@/engine/methods/citations";
import { methodByKey } from "@/engine/methods/method-entries";
import { CAUTIONS } from "@/figures/cautions";
import { fmt, limitLabel, signed } from "@/figures/format";
import type { LengthUnit } from "@/figures/length-unit";
import { ackermannBlankReason, bindsText, readoutGroups, STRENGTH_CAUTION, travelWords, zeroLockNote } from "@/figures/readout-figures";
import { formatSteerInput, steerInputWord } from "@/figures/steer-input";
import { JointAngleChart, SteerLockChart, TravelChart } from "./kit-charts";

function Figure({ id, label, value, hint, tone, method, explain }: { id?: string; label: string; value: string; hint?: string; tone?: "good" | "bad"; method: string; explain?: string }) {
  const colour = tone === "bad" ? "text-red-700" : tone === "good" ? "text-emerald-700" : "text-ink";
  return (
    <div className="rounded-md border border-ink/10 bg-white px-3 py-2">
      <dt className="text-xs text-ink-muted">
        <ExplainedLabel label={label} explain={explain ?? methodByKey(method).explain} href={methodHref(method)} testId={id ? `sheet-explain-${id}` : undefined} />
      </dt>
      <dd data-testid={id ? `sheet-${id}` : undefined} className={`text-lg font-semibold tabular-nums ${colour}`}>{value}</dd>
      {hint ? <dd className="text-xs text-ink-muted">{hint}</dd> : null}
    </div>
  );
}

function Section({ title, children, note }: { title: string; children: React.ReactNode; note?: React.ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-muted">{title}</h2>
      <dl className="grid grid-cols-2 gap-2 @lg:grid-cols-3">{children}</dl>
      {note}
    </section>
  );
}

/** The whole analysis as a sheet of figures, charts and the cautions: the editor's "Sheet" tab. */
export function AnalysisSheet({ analysis, stale, lengthUnit = "mm" }: { analysis: AnalysisResult | null; stale: boolean; lengthUnit?: LengthUnit }) {
  return (
    <div className="@container flex flex-col gap-6" data-testid="analysis-sheet">
      {stale ? <p className="text-xs font-medium text-amber-900">These figures are of an earlier layout: the one on screen has a fault or is still being analysed.</p> : null}
      {analysis ? <AnalysisView a={analysis} unit={lengthUnit} /> : <p className="text-sm text-ink-muted">No figures yet: the layout has not been analysed.</p>}
      <aside className="rounded-lg border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
        <p className="font-semibold">Cautions</p>
        <p>{CAUTIONS.join(" ")}</p>
        <p className="mt-1">How every figure is worked out, and its sources: <a href="/methods" target="_blank" rel="noopener" className="font-medium underline">the methods page</a>.</p>
      </aside>
    </div>
  );
}

function AnalysisView({ a, unit }: { a: AnalysisResult; unit: LengthUnit }) {
  const statik = a.atStatic;
  const s = a.strength;
  const kind = a.steering.input.kind;
  const zero = zeroLockNote(a, unit);
  const stop = readoutGroups(a, unit).find((g) => g.id === "stop")!;
  const ackBlank = ackermannBlankReason(a);
  return (
    <div className="flex flex-col gap-6">
      {a.warnings.length ? (
        <ul role="status" className="rounded-md border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
          {a.warnings.map((w) => <li key={w}>{w}</li>)}
        </ul>
      ) : null}
      <Section title="Steer lock" note={zero ? <p data-testid="sheet-zero-lock" className="rounded bg-amber-50 p-2 text-sm text-amber-950">{zero}</p> : null}>
        <Figure id="lock-worst" method="steer-lock" label="Inner wheel at lock (worst travel)" value={fmt(a.steerLock.worst.innerDeg, 1, "°")} hint={`outer ${fmt(a.steerLock.worst.outerDeg, 1, "°")} · at ${travelWords(a.steerLock.worst.travelMm, unit)}`} />
        <Figure method="steer-lock" label="Limited by" value={bindsText(a, a.steerLock.worst.limitedBy)} />
        <Figure method="steer-lock" label="Inner wheel at lock (static)" value={fmt(a.steerLock.static.innerDeg, 1, "°")} hint={bindsText(a, a.steerLock.static.limitedBy)} />
        <Figure method="steering-input" label="Steering input" value={`${steerInputWord(kind)} ±${formatSteerInput(a.steering.input.travel, kind, unit, 2)}`} hint={`tie rod ${fmt(a.steering.tieRodLengthMm, 1, "mm")}`} />
      </Section>
      <Section title="Steering stop">
        {stop.readouts.map((r) => <Figure key={r.id} id={r.id} method={r.method} explain={r.explain} label={r.label} value={r.value} hint={r.hint} tone={r.tone} />)}
      </Section>
      <Section title="Drive joint">
        <Figure method="joint-angle" label="Largest joint angle within lock" value={fmt(a.drive.maxJointAngleWithinLockDeg, 1, "°")} hint={`limit ${fmt(a.drive.jointLimitDeg, 1, "°")} (${limitLabel(a.drive.jointLimitBy)})`} />
        <Figure method="joint-limit" label="Neck contact angle" value={a.drive.neckContactAngleDeg === null ? "slotted cup" : fmt(a.drive.neckContactAngleDeg, 1, "°")} hint={`rated ${fmt(a.drive.ratedAngleDeg, 0, "°")}`} />
        <Figure method="plunge" label="Plunge over travel" value={`${signed(a.drive.plungeMinMm, 2)} … ${signed(a.drive.plungeMaxMm, 2, "mm")}`} />
        <Figure method="joint-angle" label="Joint angle at static" value={fmt(a.drive.staticJointAngleDeg, 1, "°")} />
        {a.drive.cardan ? <Figure method="cardan-fluctuation" label="Cardan speed fluctuation" value={fmt(a.drive.cardan.fluctuation * 100, 1, "%")} hint={`at ${fmt(a.drive.cardan.atJointAngleDeg, 1, "°")}`} /> : null}
      </Section>
      <Section title="Suspension at static">
        <Figure method="camber" label="Camber" value={signed(statik.camberDeg, 2, "°")} hint="+ top outboard" />
        <Figure method="camber-gain" label="Camber gain" value={signed(statik.camberGainDegPerMm, 3, "°/mm")} />
        <Figure method="roll-centre" label="Roll centre height" value={fmt(statik.rollCentreHeightMm, 1, "mm")} hint={statik.rollCentreHeightMm === null ? "none: the arms are parallel" : "above the ground under the wheel"} />
      </Section>
      <Section title="Steering axis">
        <Figure method="kingpin-inclination" label="Kingpin inclination" value={fmt(a.steerAxis.kingpinInclinationDeg, 1, "°")} />
        <Figure method="caster" label="Caster" value={fmt(a.steerAxis.casterDeg, 1, "°")} />
        <Figure method="scrub-radius" label="Scrub radius" value={signed(a.steerAxis.scrubRadiusMm, 1, "mm")} hint="+ axis meets ground inboard" />
        <Figure method="caster-trail" label="Caster trail" value={signed(a.steerAxis.casterTrailMm, 1, "mm")} hint="+ axis meets ground ahead" />
        <Figure id="ackermann" method="ackermann" label="Ackermann at lock" value={fmt(a.ackermann.atLockPct, 0, "%")} hint={ackBlank ?? `turn-centre form; inner-ref ${fmt(a.ackermann.innerRefAtLockPct, 0, "%")}, outer-ref ${fmt(a.ackermann.outerRefAtLockPct, 0, "%")}`} />
        <Figure method="kingpin-track" label="Kingpin track / wheelbase" value={`${fmt(a.ackermann.kingpinTrackMm, 0)} / ${fmt(a.ackermann.wheelbaseMm, 0, "mm")}`} />
      </Section>
      <Section
        title="Shaft strength at the neck"
        note={<p data-testid="sheet-strength-caution" className="rounded bg-amber-50 px-2 py-1 text-xs text-amber-950">{STRENGTH_CAUTION}</p>}
      >
        <Figure method="safety-factor" label="Safety factor" value={fmt(s.safetyFactor, 2)} hint={`target ${fmt(s.targetSafetyFactor, 1)}`} tone={s.meetsTarget ? "good" : "bad"} />
        <Figure method="shaft-torque" label="Shaft torque" value={fmt(s.shaftTorqueNmm, 0, "N·mm")} hint={`motor ${fmt(s.motorTorqueNm, 3, "N·m")} × ${fmt(s.overallRatio, 2)}`} />
        <Figure method="allowable-shear" label="Shear stress / allowable" value={`${fmt(s.shearStressMpa, 0)} / ${fmt(s.allowableShearMpa, 0, "MPa")}`} hint={s.allowableSource} />
        <Figure method="safety-factor" label="Smallest neck meeting the target" value={fmt(s.minimumNeckDiameterMm, 2, "mm")} />
      </Section>
      {s.allowableCitations.length ? (
        <p className="-mt-3 text-xs text-ink-muted" data-testid="sheet-strength-sources">
          Sources of the strength figures:{" "}
          {s.allowableCitations.map((k, i) => (
            <span key={k}>
              {i ? "; " : ""}
              <a href={methodHref(k)} target="_blank" rel="noopener" className="underline">{citationByKey(k).short}</a>
            </span>
          ))}
        </p>
      ) : null}
      <div className="grid gap-4 @4xl:grid-cols-3">
        <TravelChart travel={a.travel} />
        <SteerLockChart perTravel={a.steerLock.perTravel} />
        <JointAngleChart steps={a.steering.steps} limitDeg={a.drive.jointLimitDeg} input={a.steering.input} />
      </div>
      <table className="w-full max-w-xl rounded-lg border border-ink/10 bg-white text-sm" aria-label="Neck diameter what-if">
        <caption className="mb-1 text-left text-sm font-semibold uppercase tracking-wide text-ink-muted">Neck diameter what-if</caption>
        <thead className="bg-ink/5 text-left text-xs text-ink-muted"><tr><th className="px-3 py-1.5">Neck</th><th className="px-3 py-1.5">Shear</th><th className="px-3 py-1.5">Safety factor</th></tr></thead>
        <tbody className="divide-y divide-ink/10 tabular-nums">
          {s.neckWhatIf.map((w) => (
            <tr key={w.neckDiameterMm}>
              <td className="px-3 py-1.5">{fmt(w.neckDiameterMm, 2, "mm")}</td>
              <td className="px-3 py-1.5">{fmt(w.shearStressMpa, 0, "MPa")}</td>
              <td className={`px-3 py-1.5 ${w.meetsTarget ? "text-emerald-700" : "text-red-700"}`}>{fmt(w.safetyFactor, 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
