import "server-only";
import { eq } from "drizzle-orm";
import { DEFAULT_PREFERENCES, type Preferences } from "@/contracts/preferences";
import { db } from "../db/client";
import { userPreferences } from "../db/schema";

export async function getPreferences(userId: string): Promise<Preferences> {
  const [row] = await db.select({ lengthUnit: userPreferences.lengthUnit }).from(userPreferences).where(eq(userPreferences.userId, userId)).limit(1);
  return row ? { lengthUnit: row.lengthUnit === "in" ? "in" : "mm" } : DEFAULT_PREFERENCES;
}

export async function setPreferences(userId: string, prefs: Preferences): Promise<Preferences> {
  await db
    .insert(userPreferences)
    .values({ userId, lengthUnit: prefs.lengthUnit })
    .onConflictDoUpdate({ target: userPreferences.userId, set: { lengthUnit: prefs.lengthUnit, updatedAt: new Date() } });
  return getPreferences(userId);
}
