export const queryKeys = {
  workspaces: ["workspaces"] as const,
  kits: (workspaceId: string) => ["workspaces", workspaceId, "kits"] as const,
  kit: (workspaceId: string, kitId: string) => ["workspaces", workspaceId, "kits", kitId] as const,
  members: (workspaceId: string) => ["workspaces", workspaceId, "members"] as const,
  invitations: (workspaceId: string) => ["workspaces", workspaceId, "invitations"] as const,
  myInvitations: ["me", "invitations"] as const,
};
