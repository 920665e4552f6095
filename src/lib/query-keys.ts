export const queryKeys = {
  workspaces: ["workspaces"] as const,
  kits: (workspaceId: string) => ["workspaces", workspaceId, "kits"] as const,
  kit: (workspaceId: string, kitId: string) => ["workspaces", workspaceId, "kits", kitId] as const,
  library: (workspaceId: string, search: string) => ["workspaces", workspaceId, "kits", "library", search] as const,
  facets: (workspaceId: string) => ["workspaces", workspaceId, "kits", "facets"] as const,
  revisions: (workspaceId: string, kitId: string) => ["workspaces", workspaceId, "kits", kitId, "revisions"] as const,
  shelf: (workspaceId: string) => ["workspaces", workspaceId, "shelf"] as const,
  targets: (workspaceId: string) => ["workspaces", workspaceId, "targets"] as const,
  members: (workspaceId: string) => ["workspaces", workspaceId, "members"] as const,
  invitations: (workspaceId: string) => ["workspaces", workspaceId, "invitations"] as const,
  myInvitations: ["me", "invitations"] as const,
};
