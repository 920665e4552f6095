import { analyzeBody } from "@/contracts/analyze";
import { analysisResponse } from "@/server/analysis/pool";
import { readJson } from "@/server/http/body";
import { sessionRoute } from "@/server/http/route";

// Any signed-in user may analyse a layout they send; nothing is stored.
export const POST = sessionRoute<object>(async (req) => {
  const { layout, grid } = await readJson(req, analyzeBody);
  return analysisResponse({ layout, grid });
});
