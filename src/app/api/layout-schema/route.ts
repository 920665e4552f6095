import { layoutJsonSchema } from "@/contracts/layout";
import { publicRoute } from "@/server/http/route";

// The layout document's JSON Schema: public, like any published file format description.
export const GET = publicRoute<object>(async () => {
  return Response.json(layoutJsonSchema(), { headers: { "cache-control": "public, max-age=300" } });
});
