import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { createEditorStore, type EditorInit } from "@/editor/store/editor-store";

export const KIT = { workspaceId: "ws-1", kitId: "00000000-0000-4000-8000-000000000001", name: "Tarnwick 10 baseline", scale: "1:10", notes: "", version: 3, updatedByName: "Wren", updatedAt: "2026-12-01T10:00:00.000Z" };

export function makeStore(overrides: Partial<EditorInit> = {}, layout: Layout = TARNWICK_10_BASE) {
  return createEditorStore({ kit: KIT, layout, readOnly: false, lengthUnit: "mm", analysis: null, gridStepMm: 0.5, ...overrides });
}
