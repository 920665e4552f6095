// Number formatting for readouts: a missing figure shows as a dash, never as NaN.

export function fmt(value: number | null | undefined, digits = 1, unit = ""): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const text = value.toFixed(digits);
  const clean = text === `-${(0).toFixed(digits)}` ? (0).toFixed(digits) : text;
  return unit ? `${clean}${unit === "°" || unit === "%" ? "" : " "}${unit}` : clean;
}

export function signed(value: number | null | undefined, digits = 1, unit = ""): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const s = fmt(value, digits, unit);
  // A value that rounds to zero gets no sign.
  return Number(value.toFixed(digits)) > 0 ? `+${s}` : s;
}

const LIMIT_LABELS: Record<string, string> = {
  "neck-contact": "shaft neck meets the cup mouth",
  "slot-limit": "end of the cup slot",
  "rated-angle": "joint's rated angle",
  linkage: "tie rod and steering arm in line (toggle)",
  "rack-travel": "end of rack travel",
};

export function limitLabel(reason: string): string {
  return LIMIT_LABELS[reason] ?? reason;
}
