import { z } from "zod";
import { kitCreateFields } from "@/contracts/kits";
import { libraryQuerySchema } from "@/contracts/library";
import { createKit, queryLibrary } from "@/server/data/kits";
import { incomingLayout, requireValidLayout, starterLayout } from "@/server/data/layouts";
import { readJson, readQuery } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

// The library: one page of kits, filtered, searched and sorted on the server (see contracts/library.ts).
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (req, access) => {
  return Response.json(await queryLibrary(access.workspace.id, readQuery(req, libraryQuerySchema)));
});

const createBody = kitCreateFields.extend({ layout: incomingLayout.optional() }).strict();

export const POST = workspaceRoute<Params, "kit">("kit", "create", async (req, access) => {
  const body = await readJson(req, createBody);
  const { layout, ...fields } = body;
  const kit = await createKit(access.workspace.id, access.user.id, fields, layout === undefined ? starterLayout() : requireValidLayout(layout));
  return Response.json({ kit }, { status: 201, headers: { location: `/api/workspaces/${access.workspace.id}/kits/${kit.id}` } });
});

export type CreateKitBody = z.input<typeof createBody>;
