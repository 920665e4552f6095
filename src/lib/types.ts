// Shapes the API returns, as the client sees them (dates as ISO strings).
export type KitSummary = {
  id: string;
  name: string;
  scale: string;
  notes: string;
  version: number;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: string;
  updatedAt: string;
};
export type KitDetail = KitSummary & { workspaceId: string; layout: unknown };
export type WorkspaceSummary = { id: string; name: string; slug: string; role: string };
export type MemberRow = { id: string; userId: string; name: string; email: string; role: string; createdAt: string };
