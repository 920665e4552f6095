import { compareSheetResponse } from "@/server/exports/compare-sheet";
import { workspaceRoute } from "@/server/http/route";

// ?items=A,B@3 (the compare page's own): one PDF with each item's dimension sheet; paper, orientation and
// unit as the kit's sheet takes them. Whoever may read the kits may export them.
export const GET = workspaceRoute<{ workspaceId: string }, "kit">("kit", "read", async (req, access) => compareSheetResponse(req, access));
