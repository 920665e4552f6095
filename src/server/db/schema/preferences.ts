import { sql } from "drizzle-orm";
import { check, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { users } from "./auth";

// Per-user display choices, kept on the server so they follow the person from browser to browser.
export const userPreferences = pgTable(
  "user_preferences",
  {
    userId: text("user_id").primaryKey().references(() => users.id, { onDelete: "cascade" }),
    // Lengths are stored in mm everywhere; this is only how the editor shows and takes them.
    lengthUnit: text("length_unit").notNull().default("mm"),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("user_preferences_length_unit", sql`${t.lengthUnit} in ('mm', 'in')`)],
);
