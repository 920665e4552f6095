import { z } from "zod";

// Grid bounds of one analysis request. The product of the two caps the work one request may cost:
// 81 × 121 points is about four times the bench grid (41 × 61).
export const ANALYZE_GRID_BUDGET_POINTS = 81 * 121;

/**
 * The grid the editor's figures come from once a drag ends (the API's default): the kit page's first
 * figures and the exports use it too, so a sheet shows the numbers the editor shows.
 */
export const FULL_FIGURES_GRID = { travelSteps: 21, steerSteps: 41 } as const;

export const analyzeGrid = z
  .strictObject({
    travelSteps: z.number({ error: "grid.travelSteps must be a number" }).int("grid.travelSteps must be a whole number").min(2, "grid.travelSteps must be at least 2").max(81, "grid.travelSteps must be at most 81"),
    steerSteps: z.number({ error: "grid.steerSteps must be a number" }).int("grid.steerSteps must be a whole number").min(3, "grid.steerSteps must be at least 3").max(121, "grid.steerSteps must be at most 121"),
  })
  .partial()
  .refine((g) => (g.travelSteps ?? 21) * (g.steerSteps ?? 41) <= ANALYZE_GRID_BUDGET_POINTS, {
    message: `grid.travelSteps × grid.steerSteps must be at most ${ANALYZE_GRID_BUDGET_POINTS}`,
    path: ["steerSteps"],
  });
export type AnalyzeGrid = z.infer<typeof analyzeGrid>;

/** POST /api/analyze: a layout document (any known schema version) and an optional grid. */
export const analyzeBody = z.strictObject({
  layout: z.unknown(),
  grid: analyzeGrid.optional(),
});

/** POST /api/workspaces/{w}/kits/{k}/analyze: the stored layout, an optional grid. */
export const kitAnalyzeBody = z.strictObject({ grid: analyzeGrid.optional() });
