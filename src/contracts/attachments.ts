// Files people upload (test-run photos, reference underlays): which kinds are taken, how a name is cleaned,
// and what the API answers about a stored file. The type is always the one sniffed from the bytes.

/** Image types taken, by the MIME type sniffed from the bytes, with the extension the stored name gets. */
export const ACCEPTED_IMAGE_TYPES = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp" } as const;
export type AcceptedImageType = keyof typeof ACCEPTED_IMAGE_TYPES;
export const ACCEPTED_IMAGE_WORDS = "a JPEG, PNG or WebP image";

export function isAcceptedImageType(mime: string): mime is AcceptedImageType {
  return Object.hasOwn(ACCEPTED_IMAGE_TYPES, mime);
}

/** Header carrying the file's name (percent-encoded UTF-8) beside the raw bytes of an upload. */
export const FILE_NAME_HEADER = "x-file-name";
export const MAX_FILE_NAME = 120;

// Controls, and the bidirectional overrides that make "gpj.exe" read as "exe.jpg".
const UNSAFE_CHARS = /[\u0000-\u001f\u007f\u202a-\u202e\u2066-\u2069]/g;

/**
 * A display name from what the client sent: percent-decoded, every path part dropped (either slash), controls
 * and bidi overrides removed, whitespace collapsed, leading dots dropped, at most MAX_FILE_NAME characters with
 * the extension kept. Empty (or nothing usable) gives null.
 */
export function cleanFileName(raw: string | null | undefined): string | null {
  if (!raw) return null;
  let name = raw;
  try {
    name = decodeURIComponent(raw);
  } catch {
    // not percent-encoded: taken as it is
  }
  name = name.split(/[\\/]/).pop() ?? "";
  name = name.replace(UNSAFE_CHARS, "").replace(/\s+/g, " ").trim().replace(/^\.+/, "").trim();
  if (!name.isWellFormed()) name = name.toWellFormed();
  if (!name || name === "." || name === "..") return null;
  if (name.length > MAX_FILE_NAME) {
    const dot = name.lastIndexOf(".");
    const ext = dot > 0 && name.length - dot <= 10 ? name.slice(dot) : "";
    name = name.slice(0, MAX_FILE_NAME - ext.length) + ext;
  }
  return name;
}

/** The name with the extension of the type its bytes really are ("scan.jpeg" holding PNG → "scan.png"). */
export function nameForType(name: string | null, type: AcceptedImageType, fallback: string): string {
  const base = (name ?? fallback).replace(/\.[A-Za-z0-9]{1,8}$/, "") || fallback;
  return `${base.slice(0, MAX_FILE_NAME - 5)}.${ACCEPTED_IMAGE_TYPES[type]}`;
}

/** A stored file as the API answers it. */
export interface AttachmentInfo {
  readonly id: string;
  /** Where members of the workspace read it (the app streams it after the workspace guard). */
  readonly url: string;
  readonly contentType: AcceptedImageType;
  readonly byteSize: number;
  readonly fileName: string;
  readonly caption: string;
  readonly createdAt: string;
}

export function fileUrl(workspaceId: string, fileId: string): string {
  return `/api/workspaces/${workspaceId}/files/${fileId}`;
}

/** "2.4 MB" / "830 kB" / "512 bytes", for limits and sizes people read. */
export function formatBytes(n: number): string {
  if (n >= 1_000_000) return `${(n / 1_000_000).toFixed(n >= 10_000_000 ? 0 : 1)} MB`;
  if (n >= 1000) return `${Math.round(n / 1000)} kB`;
  return `${n} bytes`;
}
