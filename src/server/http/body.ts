import type { z } from "zod";
import { env } from "../env";
import { fieldIssues, HttpError, invalid } from "./errors";

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

/** Deepest nesting of arrays and objects a body may have; a layout document needs 4. */
export const MAX_JSON_DEPTH = 64;

/**
 * Whether JSON text nests deeper than `limit` ([ and { outside strings), found in one pass before
 * anything parses or walks it: a 20 KB body of 10,000 nested arrays would otherwise exhaust the stack of
 * whatever recurses over it next (the structured clone to the analysis worker does).
 */
export function jsonTooDeep(text: string, limit = MAX_JSON_DEPTH): boolean {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      if (++depth > limit) return true;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return false;
}

/** True for `application/json`, with or without parameters (`; charset=utf-8`); nothing else. */
export function isJsonMediaType(contentType: string | null): boolean {
  if (!contentType) return false;
  return contentType.split(";", 1)[0]!.trim().toLowerCase() === "application/json";
}

export const unsupportedMediaType = () => new HttpError(415, "unsupported_media_type", "Send the body as application/json.");

/**
 * Parses a JSON body against a schema: 415 not application/json, 413 too large, 400 not JSON, 422 nested
 * deeper than MAX_JSON_DEPTH, 422 schema failure (with field paths).
 */
export async function readJson<S extends z.ZodType>(req: Request, schema: S, limit = env.KB_MAX_BODY_BYTES): Promise<z.infer<S>> {
  const type = req.headers.get("content-type");
  if (type !== null && !isJsonMediaType(type)) throw unsupportedMediaType();
  const text = await readTextCapped(req, limit);
  // A body without a content type is not JSON by declaration (a cross-site no-cors fetch sends one so).
  if (type === null && text.length > 0) throw unsupportedMediaType();
  if (jsonTooDeep(text)) {
    throw new HttpError(422, "too_deep", `The body nests arrays or objects more than ${MAX_JSON_DEPTH} levels deep.`, [
      { path: "(body)", message: `Nested more than ${MAX_JSON_DEPTH} levels deep` },
    ]);
  }
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

/** Parses the query string against a schema (first value of each parameter): 422 naming each parameter. */
export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const input: Record<string, string> = {};
  for (const [k, v] of new URL(req.url).searchParams) if (!(k in input)) input[k] = v;
  const parsed = schema.safeParse(input);
  if (!parsed.success) {
    const fields = fieldIssues(parsed.error).map((f) => (f.path === "(body)" ? { ...f, path: "(query)" } : f));
    throw new HttpError(422, "invalid", `Invalid query: ${fields[0]!.path}: ${fields[0]!.message}`, fields);
  }
  return parsed.data;
}
