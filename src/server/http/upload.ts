import "server-only";
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import { ACCEPTED_IMAGE_WORDS, cleanFileName, FILE_NAME_HEADER, formatBytes, isAcceptedImageType, nameForType, type AcceptedImageType } from "@/contracts/attachments";
import { env } from "../env";
import { HttpError } from "./errors";

// Reading an uploaded file: the raw bytes of the body (application/octet-stream), at most KB_MAX_UPLOAD_BYTES
// read, the type taken from the bytes themselves, the name from a header with every path part dropped.

export const UPLOAD_MEDIA_TYPE = "application/octet-stream";

export interface Upload {
  readonly bytes: Buffer;
  readonly type: AcceptedImageType;
  readonly fileName: string;
  readonly sha256Hex: string;
  readonly sha256Base64: string;
}

export const fileTooLarge = (limit: number) =>
  new HttpError(413, "file_too_large", `The file is larger than the limit of ${formatBytes(limit)} (${limit} bytes). Send a smaller picture, or scale it down first.`);

/** True for `application/octet-stream`, with or without parameters. */
export function isUploadMediaType(contentType: string | null): boolean {
  return (contentType ?? "").split(";", 1)[0]!.trim().toLowerCase() === UPLOAD_MEDIA_TYPE;
}

async function readBytesCapped(req: Request, limit: number): Promise<Buffer> {
  const declared = Number(req.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > limit) throw fileTooLarge(limit);
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => {});
      throw fileTooLarge(limit);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/**
 * The upload in `req`: 415 unless sent as application/octet-stream, 413 past the size limit (before more is
 * read), 422 when empty, 415 when the bytes are not an accepted image whatever the name says.
 */
export async function readImageUpload(req: Request, fallbackName: string, limit = env.KB_MAX_UPLOAD_BYTES): Promise<Upload> {
  if (!isUploadMediaType(req.headers.get("content-type"))) {
    throw new HttpError(415, "unsupported_media_type", `Send the file's bytes as the body, with Content-Type: ${UPLOAD_MEDIA_TYPE}.`);
  }
  const bytes = await readBytesCapped(req, limit);
  if (bytes.byteLength === 0) throw new HttpError(422, "invalid", "Invalid body: file: the file is empty", [{ path: "file", message: "The file is empty" }]);
  const sniffed = await fileTypeFromBuffer(bytes);
  if (!sniffed || !isAcceptedImageType(sniffed.mime)) {
    const seen = sniffed ? `its bytes are ${sniffed.mime}` : "its bytes are not a file type we recognise";
    throw new HttpError(415, "unsupported_file_type", `The file must be ${ACCEPTED_IMAGE_WORDS}; ${seen}, whatever its name says.`, [{ path: "file", message: `Not ${ACCEPTED_IMAGE_WORDS}` }]);
  }
  return uploadFromBytes(bytes, sniffed.mime, nameForType(cleanFileName(req.headers.get(FILE_NAME_HEADER)), sniffed.mime, fallbackName));
}

/** An upload made on the server itself (the demo's pictures), with its digest, as readImageUpload gives one. */
export function uploadFromBytes(bytes: Buffer, type: AcceptedImageType, fileName: string): Upload {
  const digest = createHash("sha256").update(bytes).digest();
  return { bytes, type, fileName, sha256Hex: digest.toString("hex"), sha256Base64: digest.toString("base64") };
}
