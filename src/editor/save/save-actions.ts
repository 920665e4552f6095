// Saving the layout through the kit's layout route with the version it was based on (each save is a new
// revision, with its note), and the two ways out
// of a conflict: take the server's copy (an undoable step, so my edits stay reachable), or keep mine as a
// new kit. Nothing is lost either way.
import { parseLayout, type Layout } from "@/contracts/layout";
import type { KitDetail } from "@/contracts/kits";
import { api, ApiError } from "@/lib/api-client";
import type { EditorStore, KitRef } from "../store/editor-store";

const kitUrl = (kit: KitRef) => `/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}`;

const refOf = (k: KitDetail): Partial<KitRef> & { version: number } => ({
  name: k.name,
  scale: k.scale,
  notes: k.notes,
  version: k.version,
  updatedByName: k.updatedByName,
  updatedAt: k.updatedAt,
  headRevision: k.headRevision,
});

function messageOf(error: unknown): string {
  if (error instanceof ApiError) {
    const field = error.fields[0];
    return field ? `${error.message} (${field.path}: ${field.message})` : error.message;
  }
  return "The layout could not be saved.";
}

/** Saves the document as the kit's next revision, with the note typed for it; the store's save state says how it went (saved, conflict, or an error to show). */
export async function saveLayout(store: EditorStore): Promise<void> {
  const s = store.getState();
  if (s.readOnly || s.save.status === "saving") return;
  const layout = s.layout;
  s.setSave({ status: "saving" });
  try {
    const note = s.note.trim();
    const { kit } = await api<{ kit: KitDetail }>(`${kitUrl(s.kit)}/layout`, { method: "PUT", body: { version: s.kit.version, layout, ...(note ? { note } : {}) } });
    // What was sent is what is saved: edits made while the request was out stay marked unsaved.
    store.getState().markSaved(refOf(kit), layout);
  } catch (error) {
    if (error instanceof ApiError && error.status === 409) {
      const b = error.body as { currentVersion?: number; updatedByName?: string | null; updatedAt?: string | null };
      store.getState().setSave({ status: "conflict", currentVersion: b.currentVersion ?? s.kit.version + 1, updatedByName: b.updatedByName ?? null, updatedAt: b.updatedAt ?? null });
      return;
    }
    store.getState().setSave({ status: "error", message: messageOf(error) });
  }
}

/** Shows a kit the server answered with (after a restore): its head layout, as an undoable step. */
export function loadKitIntoEditor(store: EditorStore, kit: KitDetail): void {
  const parsed = parseLayout(kit.layout);
  if (!parsed.ok) throw new Error("The saved layout could not be read.");
  store.getState().takeServerCopy(refOf(kit), parsed.layout);
}

/** Replaces my document with the saved one (after a conflict); undo brings mine back. */
export async function reloadServerCopy(store: EditorStore): Promise<void> {
  const s = store.getState();
  try {
    const { kit } = await api<{ kit: KitDetail }>(kitUrl(s.kit));
    const parsed = parseLayout(kit.layout);
    if (!parsed.ok) throw new Error("The saved layout could not be read.");
    store.getState().takeServerCopy(refOf(kit), parsed.layout);
  } catch (error) {
    store.getState().setSave({ status: "error", message: messageOf(error) });
  }
}

const COPY_SUFFIX = " (my version)";

/**
 * Saves my document as a new kit beside the original, made as a variant of the revision I started from
 * (so it remembers where it came from), with my layout as its next revision. Answers the new kit's id.
 */
export async function saveAsNewKit(store: EditorStore, suffix = COPY_SUFFIX): Promise<string | null> {
  const s = store.getState();
  const layout: Layout = s.layout;
  const name = s.kit.name.slice(0, 120 - suffix.length) + suffix;
  try {
    s.setSave({ status: "saving" });
    const made = await api<{ kit: KitDetail }>(`${kitUrl(s.kit)}/variants`, {
      method: "POST",
      body: { name, ...(s.kit.headRevision ? { revision: s.kit.headRevision } : {}) },
    });
    const note = s.note.trim();
    const { kit } = await api<{ kit: KitDetail }>(`/api/workspaces/${s.kit.workspaceId}/kits/${made.kit.id}/layout`, {
      method: "PUT",
      body: { version: made.kit.version, layout, ...(note ? { note } : {}) },
    });
    // This document is now kept safely elsewhere: leaving the page must not warn about it.
    store.getState().markSaved({ version: s.kit.version }, layout);
    return kit.id;
  } catch (error) {
    store.getState().setSave({ status: "error", message: messageOf(error) });
    return null;
  }
}
