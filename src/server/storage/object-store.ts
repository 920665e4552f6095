import "server-only";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from "@aws-sdk/client-s3";
import { env } from "../env";
import { HttpError } from "../http/errors";

// The one door to object storage: the AWS S3 SDK against any S3-compatible provider (KB_S3_* settings; the
// local server of demo and test runs is one). Keys are made by the caller; nothing here lists a bucket.

const RETRY_AFTER_S = 5;

/** The store did not answer (down, unreachable, refused our keys): a retry may succeed; nothing was kept. */
export const fileStoreUnavailable = () =>
  new HttpError(503, "file_store_unavailable", "The file store cannot be reached just now; nothing was stored. Try again in a moment.", undefined, undefined, {
    "retry-after": String(RETRY_AFTER_S),
  });

const globalForS3 = globalThis as unknown as { knucklebenchS3?: S3Client };

function client(): S3Client {
  globalForS3.knucklebenchS3 ??= new S3Client({
    region: env.KB_S3_REGION,
    ...(env.KB_S3_ENDPOINT ? { endpoint: env.KB_S3_ENDPOINT } : {}),
    forcePathStyle: env.KB_S3_FORCE_PATH_STYLE,
    ...(env.KB_S3_ACCESS_KEY_ID && env.KB_S3_SECRET_ACCESS_KEY
      ? { credentials: { accessKeyId: env.KB_S3_ACCESS_KEY_ID, secretAccessKey: env.KB_S3_SECRET_ACCESS_KEY } }
      : {}),
    // Checksums only where the API requires them: we send our own SHA-256 with every object, and S3-compatible
    // servers differ in the optional ones the SDK would add.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts: 2,
  });
  return globalForS3.knucklebenchS3;
}

function statusOf(error: unknown): number | undefined {
  return error instanceof S3ServiceException ? error.$metadata.httpStatusCode : undefined;
}

/** Anything but "no such key" from the store is a store that cannot serve us now; logged as one line. */
function unavailable(error: unknown, what: string): HttpError {
  const e = error as { name?: string; message?: string };
  console.warn(`file store: ${what} failed (${e.name ?? "Error"}: ${(e.message ?? String(error)).split("\n", 1)[0]})`);
  return fileStoreUnavailable();
}

/** Stores `bytes` under `key`, with the type sniffed from them and their SHA-256 (base64) for the store to check. */
export async function putObject(key: string, bytes: Uint8Array, contentType: string, sha256Base64: string): Promise<void> {
  try {
    await client().send(new PutObjectCommand({ Bucket: env.KB_S3_BUCKET, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength, ChecksumSHA256: sha256Base64 }));
  } catch (error) {
    throw unavailable(error, "storing a file");
  }
}

export interface StoredObject {
  readonly body: ReadableStream<Uint8Array>;
  readonly byteSize: number | undefined;
}

/** The object's bytes as a stream, or null when the store has no such key. */
export async function getObject(key: string): Promise<StoredObject | null> {
  try {
    const out = await client().send(new GetObjectCommand({ Bucket: env.KB_S3_BUCKET, Key: key }));
    if (!out.Body) return null;
    return { body: out.Body.transformToWebStream() as ReadableStream<Uint8Array>, byteSize: out.ContentLength };
  } catch (error) {
    if (statusOf(error) === 404 || (error as { name?: string }).name === "NoSuchKey") return null;
    throw unavailable(error, "reading a file");
  }
}

/**
 * Removes objects whose rows are gone. Best effort, after the database committed: a store that is down
 * leaves an unreachable object (logged with its key), never a row pointing at nothing.
 */
export async function deleteObjects(keys: readonly string[]): Promise<void> {
  for (const key of keys) {
    try {
      await client().send(new DeleteObjectCommand({ Bucket: env.KB_S3_BUCKET, Key: key }));
    } catch (error) {
      console.warn(`file store: could not remove ${key} (${(error as Error).name}); it is no longer referenced`);
    }
  }
}
