import { fileIdOrNotFound, readAttachment } from "@/server/data/attachments";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; fileId: string };

/**
 * A stored file, streamed to a member of its workspace (the store itself is never exposed). Served with the
 * type sniffed at upload, never sniffed again by the browser, and in a sandbox: a picture cannot run anything.
 */
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (req, access, params) => {
  const { row, object } = await readAttachment(access.workspace.id, fileIdOrNotFound(params.fileId));
  const download = new URL(req.url).searchParams.get("download") === "1";
  const etag = `"${row.sha256}"`;
  const headers: Record<string, string> = {
    "content-type": row.contentType,
    "content-length": String(object.byteSize ?? row.byteSize),
    "content-disposition": `${download ? "attachment" : "inline"}; filename*=UTF-8''${encodeURIComponent(row.fileName)}`,
    "x-content-type-options": "nosniff",
    "content-security-policy": "default-src 'none'; sandbox",
    // Private: only this member's browser may keep it, and the content never changes under its id.
    "cache-control": "private, max-age=3600, immutable",
    etag,
  };
  if (req.headers.get("if-none-match") === etag) {
    await object.body.cancel();
    return new Response(null, { status: 304, headers: { etag, "cache-control": headers["cache-control"]! } });
  }
  return new Response(object.body, { status: 200, headers });
});
