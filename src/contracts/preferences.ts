import { z } from "zod";

// A person's display choices. Lengths are always stored in millimetres; the unit is only how they are shown.

export const LENGTH_UNITS = ["mm", "in"] as const;
export type LengthUnitChoice = (typeof LENGTH_UNITS)[number];

export const preferencesBody = z
  .object({ lengthUnit: z.enum(LENGTH_UNITS, { error: "lengthUnit must be mm or in" }) })
  .strict();
export type Preferences = z.infer<typeof preferencesBody>;

export const DEFAULT_PREFERENCES: Preferences = { lengthUnit: "mm" };
