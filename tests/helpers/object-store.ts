// The object store the integration tests write to (the throwaway local server scripts/test.sh starts, through
// the same SDK and settings as the app), pictures made for the tests, and uploads sent as a browser sends them.
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import sharp from "sharp";
import { FILE_NAME_HEADER } from "@/contracts/attachments";
import { BASE } from "./api";

let s3: S3Client | undefined;

function client(): S3Client {
  if (!process.env.KB_S3_ENDPOINT) throw new Error("KB_S3_ENDPOINT is not set: run the integration tests through npm test (or start the local object store)");
  if (!s3) {
    s3 = new S3Client({
      endpoint: process.env.KB_S3_ENDPOINT,
      region: process.env.KB_S3_REGION ?? "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: process.env.KB_S3_ACCESS_KEY_ID!, secretAccessKey: process.env.KB_S3_SECRET_ACCESS_KEY! },
    });
    // The local server signs a bucket's own path without its trailing slash; S3 treats "/bucket/" and "/bucket" alike.
    s3.middlewareStack.add(
      (next) => async (args) => {
        const request = args.request as { path?: string };
        if (request.path && /^\/[^/]+\/$/.test(request.path)) request.path = request.path.slice(0, -1);
        return next(args);
      },
      { step: "build", name: "bucketPathWithoutSlash" },
    );
  }
  return s3;
}

/** Every key in the bucket under `prefix` (a workspace's files are under `files/{workspaceId}/`). */
export async function storedKeys(prefix: string): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const page = await client().send(new ListObjectsV2Command({ Bucket: process.env.KB_S3_BUCKET ?? "knucklebench", Prefix: prefix, ContinuationToken: token }));
    keys.push(...(page.Contents ?? []).map((o) => o.Key!));
    token = page.NextContinuationToken;
  } while (token);
  return keys;
}

export const filesOf = (workspaceId: string) => storedKeys(`files/${workspaceId}/`);

/** A real PNG of `width` × `height` in one colour. */
export function pngBytes(width = 64, height = 48, colour = { r: 40, g: 90, b: 160 }): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: colour } }).png().toBuffer();
}

export function jpegBytes(width = 64, height = 48): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 200, g: 120, b: 30 } } }).jpeg().toBuffer();
}

/** The first bytes of a PDF: a real file type, not an image. */
export const PDF_BYTES = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");

type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;

export interface UploadOptions {
  cookie?: string;
  name?: string;
  contentType?: string;
  headers?: Record<string, string>;
  /** Sent as a stream with no Content-Length (as a chunked upload arrives). */
  streamed?: boolean;
}

/** Sends `bytes` as an upload (application/octet-stream, the name in X-File-Name) from the app's own origin. */
export async function upload<P>(handler: Handler<P>, method: string, path: string, params: P, bytes: Uint8Array, opts: UploadOptions = {}) {
  const headers: Record<string, string> = { origin: new URL(BASE).origin, "content-type": opts.contentType ?? "application/octet-stream", ...opts.headers };
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.name !== undefined) headers[FILE_NAME_HEADER] = encodeURIComponent(opts.name);
  const body = opts.streamed
    ? new ReadableStream<Uint8Array>({
        start(c) {
          for (let i = 0; i < bytes.byteLength; i += 65_536) c.enqueue(bytes.subarray(i, i + 65_536));
          c.close();
        },
      })
    : new Blob([new Uint8Array(bytes)]);
  const init: RequestInit & { duplex?: "half" } = { method, headers, body, ...(opts.streamed ? { duplex: "half" } : {}) };
  const res = await handler(new Request(`${BASE}${path}`, init), { params: Promise.resolve(params) });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = text;
  }
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return { status: res.status, json: json as any, headers: res.headers };
}

/** GETs a file route and answers its status, headers and bytes. */
export async function download<P>(handler: Handler<P>, path: string, params: P, cookie?: string) {
  const res = await handler(new Request(`${BASE}${path}`, { headers: cookie ? { cookie } : {} }), { params: Promise.resolve(params) });
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) };
}
