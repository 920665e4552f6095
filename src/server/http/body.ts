import type { z } from "zod";
import { env } from "../env";
import { HttpError, invalid } from "./errors";

/** Reads at most `limit` bytes of the body, so a huge upload is refused without buffering it. */
async function readTextCapped(req: Request, limit: number): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  if (!req.body) return "";
  // A declared length within the limit is enforced by the HTTP layer: read it in one go.
  if (Number.isFinite(declared)) {
    const text = await req.text();
    if (Buffer.byteLength(text) > limit) throw tooLarge(limit);
    return text;
  }
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => {});
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

const tooLarge = (limit: number) =>
  new HttpError(413, "too_large", `The request body is larger than the limit of ${limit} bytes.`);

/** Parses a JSON body against a schema: 413 too large, 400 not JSON, 422 schema failure (with field paths). */
export async function readJson<S extends z.ZodType>(req: Request, schema: S, limit = env.KB_MAX_BODY_BYTES): Promise<z.infer<S>> {
  const type = req.headers.get("content-type") ?? "";
  if (type && !type.toLowerCase().includes("json")) {
    throw new HttpError(415, "unsupported_media_type", "Send the body as application/json.");
  }
  const text = await readTextCapped(req, limit);
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new HttpError(400, "malformed_json", text.trim() ? "The body is not valid JSON." : "The request needs a JSON body.");
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw invalid(parsed.error);
  return parsed.data;
}
