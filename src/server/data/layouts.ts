import "server-only";
import { z } from "zod";

// Interim: any JSON object. Replaced by the schema-versioned layout contract.
export const incomingLayout = z.record(z.string(), z.unknown());
export function readStoredLayout(stored: unknown): unknown {
  return stored;
}
export function starterLayout(): unknown {
  return {};
}
