import { analyzeBody } from "@/contracts/analyze";
import { analyzeDocument } from "@/server/data/analysis";
import { readJson } from "@/server/http/body";
import { sessionRoute } from "@/server/http/route";

// Any signed-in user may analyse a layout they send; nothing is stored.
export const POST = sessionRoute<object>(async (req) => {
  const { layout, grid } = await readJson(req, analyzeBody);
  return Response.json({ analysis: analyzeDocument(layout, grid) });
});
