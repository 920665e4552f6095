import "server-only";
import { and, eq } from "drizzle-orm";
import { UNDERLAY_VIEWS, underlayPlacementSchema, type Underlay, type UnderlayPlacement, type UnderlayView } from "@/contracts/underlays";
import { db } from "../db/client";
import { attachments, kitUnderlays } from "../db/schema";
import { HttpError, invalid, notFound } from "../http/errors";
import type { Upload } from "../http/upload";
import { deleteObjects } from "../storage/object-store";
import { storeAttachment, toAttachmentInfo } from "./attachments";
import { getKit } from "./kits";

export function underlayViewOrNotFound(raw: string): UnderlayView {
  if (!(UNDERLAY_VIEWS as readonly string[]).includes(raw)) throw notFound("View");
  return raw as UnderlayView;
}

/** A placement a client sent in a header (percent-encoded JSON), or null for none: 422 names the field. */
export function placementFromHeader(raw: string | null): UnderlayPlacement | null {
  if (!raw) return null;
  let data: unknown;
  try {
    data = JSON.parse(decodeURIComponent(raw));
  } catch {
    throw new HttpError(422, "invalid", "Invalid header: x-underlay-placement is not percent-encoded JSON", [{ path: "placement", message: "Not JSON" }]);
  }
  const parsed = underlayPlacementSchema.safeParse(data);
  if (!parsed.success) throw invalid(parsed.error, "placement");
  return parsed.data;
}

const DEFAULT_PLACEMENT: UnderlayPlacement = { anchorPx: { x: 0, y: 0 }, anchorMm: { u: 0, v: 0 }, mmPerPx: 0.25, rotationDeg: 0, picks: null };

async function rows(workspaceId: string, kitId: string, view?: UnderlayView) {
  return db
    .select({ u: kitUnderlays, f: attachments })
    .from(kitUnderlays)
    .innerJoin(attachments, eq(attachments.id, kitUnderlays.attachmentId))
    .where(and(eq(kitUnderlays.workspaceId, workspaceId), eq(kitUnderlays.kitId, kitId), ...(view ? [eq(kitUnderlays.view, view)] : [])));
}

function toUnderlay(r: Awaited<ReturnType<typeof rows>>[number]): Underlay {
  return {
    id: r.u.id,
    view: r.u.view as UnderlayView,
    file: toAttachmentInfo(r.f),
    placement: r.u.placement as UnderlayPlacement,
    opacity: r.u.opacity,
    visible: r.u.visible,
    version: r.u.version,
    updatedAt: r.u.updatedAt.toISOString(),
  };
}

/** The kit's underlays (at most one per view). */
export async function listUnderlays(workspaceId: string, kitId: string): Promise<Underlay[]> {
  await getKit(workspaceId, kitId);
  return (await rows(workspaceId, kitId)).map(toUnderlay);
}

async function getUnderlay(workspaceId: string, kitId: string, view: UnderlayView): Promise<Underlay> {
  const [r] = await rows(workspaceId, kitId, view);
  if (!r) {
    await getKit(workspaceId, kitId);
    throw notFound("Underlay");
  }
  return toUnderlay(r);
}

/**
 * Puts a picture under a view: a new one, or in place of the one there (whose file is then removed). Stored
 * only once the kit is known to be this workspace's.
 */
export async function putUnderlay(workspaceId: string, kitId: string, view: UnderlayView, userId: string, placement: UnderlayPlacement | null, readUpload: () => Promise<Upload>): Promise<Underlay> {
  await getKit(workspaceId, kitId);
  const upload = await readUpload();
  const { result: replaced } = await storeAttachment({ workspaceId, kitId, purpose: "underlay", upload, userId }, async (tx, file) => {
    const [old] = await tx.select({ attachmentId: kitUnderlays.attachmentId }).from(kitUnderlays).where(and(eq(kitUnderlays.kitId, kitId), eq(kitUnderlays.view, view))).for("update");
    await tx
      .insert(kitUnderlays)
      .values({ workspaceId, kitId, view, attachmentId: file.id, placement: placement ?? DEFAULT_PLACEMENT, updatedBy: userId })
      .onConflictDoUpdate({
        target: [kitUnderlays.kitId, kitUnderlays.view],
        set: { attachmentId: file.id, placement: placement ?? DEFAULT_PLACEMENT, version: 1, visible: true, updatedBy: userId, updatedAt: new Date() },
      });
    if (!old) return [] as string[];
    const gone = await tx.delete(attachments).where(eq(attachments.id, old.attachmentId)).returning({ key: attachments.objectKey });
    return gone.map((g) => g.key);
  });
  await deleteObjects(replaced);
  return getUnderlay(workspaceId, kitId, view);
}

/** Moves, scales, fades or hides an underlay if it is still at `version` (else 409). */
export async function patchUnderlay(
  workspaceId: string,
  kitId: string,
  view: UnderlayView,
  userId: string,
  patch: { version: number; placement?: UnderlayPlacement; opacity?: number; visible?: boolean },
): Promise<Underlay> {
  const { version, ...fields } = patch;
  const done = await db
    .update(kitUnderlays)
    .set({ ...fields, version: version + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(kitUnderlays.workspaceId, workspaceId), eq(kitUnderlays.kitId, kitId), eq(kitUnderlays.view, view), eq(kitUnderlays.version, version)))
    .returning({ id: kitUnderlays.id });
  if (done.length === 0) {
    const now = await getUnderlay(workspaceId, kitId, view);
    throw new HttpError(409, "stale_version", `This underlay changed since version ${version}; it is now at version ${now.version}.`, [{ path: "version", message: `Stale: the current version is ${now.version}` }], { currentVersion: now.version, underlay: now });
  }
  return getUnderlay(workspaceId, kitId, view);
}

/** Removes a view's underlay and its file. */
export async function deleteUnderlay(workspaceId: string, kitId: string, view: UnderlayView): Promise<void> {
  const underlay = await getUnderlay(workspaceId, kitId, view);
  const gone = await db.delete(attachments).where(and(eq(attachments.workspaceId, workspaceId), eq(attachments.id, underlay.file.id))).returning({ key: attachments.objectKey });
  await deleteObjects(gone.map((g) => g.key));
}
