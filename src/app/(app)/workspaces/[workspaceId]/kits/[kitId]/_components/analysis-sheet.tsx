"use client";
import type { AnalysisResult } from "@/engine";
import { CAUTIONS } from "@/figures/cautions";
import { fmt, limitLabel, signed } from "@/figures/format";
import { JointAngleChart, SteerLockChart, TravelChart } from "./kit-charts";

function Figure({ label, value, hint, tone }: { label: string; value: string; hint?: string; tone?: "good" | "bad" }) {
  const colour = tone === "bad" ? "text-red-700" : tone === "good" ? "text-emerald-700" : "text-ink";
  return (
    <div className="rounded-md border border-ink/10 bg-white px-3 py-2">
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd className={`text-lg font-semibold tabular-nums ${colour}`}>{value}</dd>
      {hint ? <dd className="text-xs text-ink-muted">{hint}</dd> : null}
    </div>
  );
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h2 className="text-sm font-semibold uppercase tracking-wide text-ink-muted">{title}</h2>
      <dl className="grid grid-cols-2 gap-2 @lg:grid-cols-3">{children}</dl>
    </section>
  );
}

/** The whole analysis as a sheet of figures, charts and the cautions: the editor's "Sheet" tab. */
export function AnalysisSheet({ analysis, stale }: { analysis: AnalysisResult | null; stale: boolean }) {
  return (
    <div className="@container flex flex-col gap-6" data-testid="analysis-sheet">
      {stale ? <p className="text-xs font-medium text-amber-900">These figures are of an earlier layout: the one on screen has a fault or is still being analysed.</p> : null}
      {analysis ? <AnalysisView a={analysis} /> : <p className="text-sm text-ink-muted">No figures yet: the layout has not been analysed.</p>}
      <aside className="rounded-lg border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
        <p className="font-semibold">Cautions</p>
        <p>{CAUTIONS.join(" ")}</p>
      </aside>
    </div>
  );
}

function AnalysisView({ a }: { a: AnalysisResult }) {
  const statik = a.atStatic;
  const s = a.strength;
  return (
    <div className="flex flex-col gap-6">
      {a.warnings.length ? (
        <ul role="status" className="rounded-md border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
          {a.warnings.map((w) => <li key={w}>{w}</li>)}
        </ul>
      ) : null}
      <Section title="Steer lock">
        <Figure label="Inner wheel at lock (worst travel)" value={fmt(a.steerLock.worst.innerDeg, 1, "°")} hint={`outer ${fmt(a.steerLock.worst.outerDeg, 1, "°")} · at ${signed(a.steerLock.worst.travelMm, 1, "mm")} travel`} />
        <Figure label="Limited by" value={limitLabel(a.steerLock.worst.limitedBy)} />
        <Figure label="Inner wheel at lock (static)" value={fmt(a.steerLock.static.innerDeg, 1, "°")} hint={limitLabel(a.steerLock.static.limitedBy)} />
      </Section>
      <Section title="Drive joint">
        <Figure label="Largest joint angle within lock" value={fmt(a.drive.maxJointAngleWithinLockDeg, 1, "°")} hint={`limit ${fmt(a.drive.jointLimitDeg, 1, "°")} (${limitLabel(a.drive.jointLimitBy)})`} />
        <Figure label="Neck contact angle" value={fmt(a.drive.neckContactAngleDeg, 1, "°")} hint={`rated ${fmt(a.drive.ratedAngleDeg, 0, "°")}`} />
        <Figure label="Least neck clearance" value={fmt(a.drive.minNeckClearanceMm, 2, "mm")} tone={a.drive.minNeckClearanceMm !== null && a.drive.minNeckClearanceMm < 0.05 ? "bad" : undefined} />
        <Figure label="Plunge over travel" value={`${signed(a.drive.plungeMinMm, 2)} … ${signed(a.drive.plungeMaxMm, 2, "mm")}`} />
        <Figure label="Joint angle at static" value={fmt(a.drive.staticJointAngleDeg, 1, "°")} />
        {a.drive.cardan ? <Figure label="Cardan speed fluctuation" value={fmt(a.drive.cardan.fluctuation * 100, 1, "%")} hint={`at ${fmt(a.drive.cardan.atJointAngleDeg, 1, "°")}`} /> : null}
      </Section>
      <Section title="Suspension at static">
        <Figure label="Camber" value={signed(statik.camberDeg, 2, "°")} hint="+ top outboard" />
        <Figure label="Camber gain" value={signed(statik.camberGainDegPerMm, 3, "°/mm")} />
        <Figure label="Roll centre height" value={fmt(statik.rollCentreHeightMm, 1, "mm")} hint="above the ground under the wheel" />
      </Section>
      <Section title="Steering axis">
        <Figure label="Kingpin inclination" value={fmt(a.steerAxis.kingpinInclinationDeg, 1, "°")} />
        <Figure label="Caster" value={fmt(a.steerAxis.casterDeg, 1, "°")} />
        <Figure label="Scrub radius" value={signed(a.steerAxis.scrubRadiusMm, 1, "mm")} hint="+ axis meets ground inboard" />
        <Figure label="Caster trail" value={signed(a.steerAxis.casterTrailMm, 1, "mm")} hint="+ axis meets ground ahead" />
        <Figure label="Ackermann at lock" value={fmt(a.ackermann.atLockPct, 0, "%")} hint={`turn-centre form; inner-ref ${fmt(a.ackermann.innerRefAtLockPct, 0, "%")}, outer-ref ${fmt(a.ackermann.outerRefAtLockPct, 0, "%")}`} />
        <Figure label="Kingpin track / wheelbase" value={`${fmt(a.ackermann.kingpinTrackMm, 0)} / ${fmt(a.ackermann.wheelbaseMm, 0, "mm")}`} />
      </Section>
      <Section title="Shaft strength at the neck">
        <Figure label="Safety factor" value={fmt(s.safetyFactor, 2)} hint={`target ${fmt(s.targetSafetyFactor, 1)}`} tone={s.meetsTarget ? "good" : "bad"} />
        <Figure label="Shaft torque" value={fmt(s.shaftTorqueNmm, 0, "N·mm")} hint={`motor ${fmt(s.motorTorqueNm, 3, "N·m")} × ${fmt(s.overallRatio, 2)}`} />
        <Figure label="Shear stress / allowable" value={`${fmt(s.shearStressMpa, 0)} / ${fmt(s.allowableShearMpa, 0, "MPa")}`} hint={s.allowableSource} />
        <Figure label="Smallest neck meeting the target" value={fmt(s.minimumNeckDiameterMm, 2, "mm")} />
      </Section>
      <div className="grid gap-4 @4xl:grid-cols-3">
        <TravelChart travel={a.travel} />
        <SteerLockChart perTravel={a.steerLock.perTravel} />
        <JointAngleChart steps={a.steering.steps} limitDeg={a.drive.jointLimitDeg} />
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
