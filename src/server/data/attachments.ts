import "server-only";
import { randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { fileUrl, type AcceptedImageType, type AttachmentInfo } from "@/contracts/attachments";
import { db } from "../db/client";
import { attachments, kits } from "../db/schema";
import { notFound } from "../http/errors";
import type { Upload } from "../http/upload";
import { deleteObjects, getObject, putObject, type StoredObject } from "../storage/object-store";

type Row = typeof attachments.$inferSelect;
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** A file id from the URL; anything but a UUID is a file that is not there. */
export function fileIdOrNotFound(raw: string): string {
  if (!z.string().uuid().safeParse(raw).success) throw notFound("File");
  return raw;
}

export function toAttachmentInfo(r: Pick<Row, "id" | "workspaceId" | "contentType" | "byteSize" | "fileName" | "caption" | "createdAt">): AttachmentInfo {
  return {
    id: r.id,
    url: fileUrl(r.workspaceId, r.id),
    contentType: r.contentType as AcceptedImageType,
    byteSize: r.byteSize,
    fileName: r.fileName,
    caption: r.caption,
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * A key nobody can guess or derive: 192 random bits under the workspace's prefix (so an operator can find a
 * workspace's files); nothing of the file's name or content is in it.
 */
export function newObjectKey(workspaceId: string): string {
  return `files/${workspaceId}/${randomBytes(24).toString("base64url")}`;
}

export interface NewAttachment {
  readonly workspaceId: string;
  readonly kitId: string;
  readonly testRunId?: string | null;
  readonly purpose: "test-photo" | "underlay";
  readonly upload: Upload;
  readonly userId: string;
  readonly caption?: string;
}

/**
 * Stores the bytes, then the row (in `write`, a transaction that may add rows that refer to it). Whatever
 * fails after the object was stored removes it again, so no file is left that no row names.
 */
export async function storeAttachment<T>(a: NewAttachment, write: (tx: Tx, row: Row) => Promise<T> = async () => undefined as T): Promise<{ row: Row; result: T }> {
  const key = newObjectKey(a.workspaceId);
  await putObject(key, a.upload.bytes, a.upload.type, a.upload.sha256Base64);
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(attachments)
        .values({
          workspaceId: a.workspaceId,
          kitId: a.kitId,
          testRunId: a.testRunId ?? null,
          purpose: a.purpose,
          objectKey: key,
          contentType: a.upload.type,
          byteSize: a.upload.bytes.byteLength,
          sha256: a.upload.sha256Hex,
          fileName: a.upload.fileName,
          caption: a.caption ?? "",
          createdBy: a.userId,
        })
        .returning();
      return { row: row!, result: await write(tx, row!) };
    });
  } catch (error) {
    await deleteObjects([key]);
    throw error;
  }
}

/** A file of this workspace with its bytes; 404 for one of another workspace, or one the store lost. */
export async function readAttachment(workspaceId: string, fileId: string): Promise<{ row: Row; object: StoredObject }> {
  const [row] = await db
    .select()
    .from(attachments)
    .where(and(eq(attachments.workspaceId, workspaceId), eq(attachments.id, fileId)))
    .limit(1);
  if (!row) throw notFound("File");
  const object = await getObject(row.objectKey);
  if (!object) {
    console.warn(`file store: the object of file ${row.id} is missing`);
    throw notFound("File");
  }
  return { row, object };
}

/** Deletes a kit (its runs, photos and underlays go with it) and then the objects of its files. */
export async function deleteKitWithFiles(workspaceId: string, kitId: string): Promise<void> {
  const keys = await db.transaction(async (tx) => {
    const files = await tx.delete(attachments).where(and(eq(attachments.workspaceId, workspaceId), eq(attachments.kitId, kitId))).returning({ key: attachments.objectKey });
    const deleted = await tx.delete(kits).where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId))).returning({ id: kits.id });
    if (deleted.length === 0) throw notFound("Kit");
    return files.map((f) => f.key);
  });
  await deleteObjects(keys);
}
