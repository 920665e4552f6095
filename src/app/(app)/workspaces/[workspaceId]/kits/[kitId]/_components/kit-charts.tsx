"use client";
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SteerLockResult, SteerStepResult, TravelStepResult } from "@/engine";

function Frame({ title, children }: { title: string; children: React.ReactElement }) {
  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-3">
      <figcaption className="mb-2 text-sm font-medium">{title}</figcaption>
      <div className="h-56">
        <ResponsiveContainer width="100%" height="100%">{children}</ResponsiveContainer>
      </div>
    </figure>
  );
}

const round = (v: number | null, d = 3) => (v === null ? null : Number(v.toFixed(d)));

export function TravelChart({ travel }: { travel: readonly TravelStepResult[] }) {
  const data = travel.map((t) => ({ travel: round(t.travelMm, 1), camber: round(t.camberDeg), rc: round(t.rollCentreHeightMm, 2) }));
  return (
    <Frame title="Camber and roll centre over travel">
      <LineChart data={data} margin={{ left: -10, right: 8 }}>
        <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
        <XAxis dataKey="travel" type="number" domain={["dataMin", "dataMax"]} unit=" mm" fontSize={11} />
        <YAxis yAxisId="c" fontSize={11} unit="°" />
        <YAxis yAxisId="r" orientation="right" fontSize={11} unit=" mm" />
        <Tooltip />
        <Legend wrapperStyle={{ fontSize: 11 }} />
        <Line yAxisId="c" type="monotone" dataKey="camber" name="camber °" stroke="#3d5a73" dot={false} isAnimationActive={false} />
        <Line yAxisId="r" type="monotone" dataKey="rc" name="roll centre mm" stroke="#c2410c" dot={false} isAnimationActive={false} connectNulls={false} />
      </LineChart>
    </Frame>
  );
}

export function SteerLockChart({ perTravel }: { perTravel: readonly SteerLockResult[] }) {
  const data = perTravel.map((l) => ({ travel: round(l.travelMm, 1), inner: round(l.innerDeg, 2), outer: round(l.outerDeg, 2) }));
  return (
    <Frame title="Steer lock over travel">
      <LineChart data={data} margin={{ left: -10, right: 8 }}>
        <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
        <XAxis dataKey="travel" type="number" domain={["dataMin", "dataMax"]} unit=" mm" fontSize={11} />
        <YAxis fontSize={11} unit="°" />
        <Tooltip />
        <Legend wrapperStyle={{ fontSize: 11 }} />
        <Line type="monotone" dataKey="inner" name="inner wheel °" stroke="#3d5a73" dot={false} isAnimationActive={false} />
        <Line type="monotone" dataKey="outer" name="outer wheel °" stroke="#7c9cb5" dot={false} isAnimationActive={false} />
      </LineChart>
    </Frame>
  );
}

export function JointAngleChart({ steps, limitDeg }: { steps: readonly SteerStepResult[]; limitDeg: number }) {
  const data = steps.map((s) => ({ rack: round(s.rackMm, 2), left: round(s.leftJointAngleDeg, 2), right: round(s.rightJointAngleDeg, 2) }));
  return (
    <Frame title="Joint angle over rack travel (static)">
      <LineChart data={data} margin={{ left: -10, right: 8 }}>
        <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
        <XAxis dataKey="rack" type="number" domain={["dataMin", "dataMax"]} unit=" mm" fontSize={11} />
        <YAxis fontSize={11} unit="°" />
        <Tooltip />
        <Legend wrapperStyle={{ fontSize: 11 }} />
        <ReferenceLine y={Number(limitDeg.toFixed(2))} stroke="#b91c1c" strokeDasharray="4 3" label={{ value: "limit", fontSize: 10, fill: "#b91c1c" }} />
        <Line type="monotone" dataKey="left" name="left joint °" stroke="#3d5a73" dot={false} isAnimationActive={false} />
        <Line type="monotone" dataKey="right" name="right joint °" stroke="#c2410c" dot={false} isAnimationActive={false} />
      </LineChart>
    </Frame>
  );
}
