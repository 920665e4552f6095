import "server-only";
// What a share link shows: the kit's name and scale, and the layout of the revision it opens (the one
// pinned, or the head as it is now), with the words a download's title block needs.
import type { SharedKit } from "@/contracts/sharing";
import type { ExportMeta } from "../exports/export-kit";
import { getKit } from "./kits";
import { readStoredLayout } from "./layouts";
import { getRevision } from "./revisions";
import type { OpenShareLink } from "./share-links";

export interface SharedKitData extends SharedKit {
  readonly meta: ExportMeta;
}

export async function readSharedKit(link: OpenShareLink): Promise<SharedKitData> {
  const kit = await getKit(link.workspaceId, link.kitId);
  const number = link.revision ?? kit.headRevision;
  const rev = await getRevision(link.workspaceId, link.kitId, number);
  return {
    kitName: kit.name,
    workspaceName: link.workspaceName,
    scale: kit.scale,
    revision: number,
    pinned: link.revision !== null,
    allowComments: link.allowComments,
    expiresAt: link.expiresAt,
    layout: link.revision === null ? readStoredLayout(kit.layout) : rev.layout,
    meta: {
      kitName: kit.name,
      workspaceName: link.workspaceName,
      revision: String(number),
      author: rev.authorName ?? "—",
      date: rev.createdAt,
      modelScale: kit.scale,
    },
  };
}
