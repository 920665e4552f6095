// The one permissions statement: resources × actions, and what each workspace role may do.
// better-auth's access control is built from it on the server (src/server/auth/access.ts), and the
// UI reads the same table to decide which controls to show — the server still checks every call.

export const statement = {
  organization: ["update", "delete"],
  member: ["read", "create", "update", "delete"],
  invitation: ["create", "cancel"],
  kit: ["read", "create", "update", "delete"],
  shelf: ["read", "create", "update", "delete"],
  target: ["read", "update"],
} as const;

export type Resource = keyof typeof statement;
export type Action<R extends Resource> = (typeof statement)[R][number];
export type Grants = { [R in Resource]?: readonly Action<R>[] };

export const WORKSPACE_ROLES = ["owner", "admin", "editor", "viewer"] as const;
export type WorkspaceRole = (typeof WORKSPACE_ROLES)[number];

const viewer = { kit: ["read"], member: ["read"], shelf: ["read"], target: ["read"] } as const satisfies Grants;
const editor = { kit: ["read", "create", "update", "delete"], member: ["read"], shelf: ["read", "create", "update", "delete"], target: ["read"] } as const satisfies Grants;
// The workspace's targets are the team's bar: admins set them; editors override them per kit.
const admin = {
  ...editor,
  target: ["read", "update"],
  organization: ["update"],
  member: ["read", "create", "update", "delete"],
  invitation: ["create", "cancel"],
} as const satisfies Grants;
const owner = { ...admin, organization: ["update", "delete"] } as const satisfies Grants;

export const roleGrants: Record<WorkspaceRole, Grants> = { owner, admin, editor, viewer };

export const ROLE_DESCRIPTIONS: Record<WorkspaceRole, string> = {
  owner: "Everything, including deleting the workspace and naming other owners",
  admin: "Manages members and roles and the workspace's targets, and edits kits",
  editor: "Creates, edits and deletes kits and shelf items",
  viewer: "Reads kits, analyses, the shelf and the targets",
};

export function isWorkspaceRole(value: unknown): value is WorkspaceRole {
  return typeof value === "string" && (WORKSPACE_ROLES as readonly string[]).includes(value);
}

/** Whether a role (better-auth may store several, comma-separated) grants `action` on `resource`. */
export function roleCan<R extends Resource>(role: string, resource: R, action: Action<R>): boolean {
  return role
    .split(",")
    .map((r) => r.trim())
    .some((r) => isWorkspaceRole(r) && ((roleGrants[r][resource] ?? []) as readonly string[]).includes(action));
}
