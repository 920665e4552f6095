import { z } from "zod";
import { WORKSPACE_ROLES } from "./roles";
import { isStorableText, storableTextMessage } from "./text";

const role = z.enum(WORKSPACE_ROLES, { error: `Role must be one of ${WORKSPACE_ROLES.join(", ")}` });

/** An invitation to join a workspace: POST /api/workspaces/[workspaceId]/members. The address is kept lower-case. */
export const invitationCreateBody = z
  .object({
    email: z.string({ error: "E-mail is required" }).trim().toLowerCase().email("Enter a valid e-mail address").max(254, "E-mail must be at most 254 characters"),
    role,
  })
  .strict();
export type InvitationCreateBody = z.infer<typeof invitationCreateBody>;

/**
 * The answer to an invitation, the same whether or not the address has an account or is a member already,
 * so the answer tells nothing about who uses the product.
 */
export type InvitationSent = { email: string; role: string; status: "pending" };

/** Whether the message carrying an invitation's link went out: sent, waiting for a retry, or given up on. */
export type InvitationMailState = "sent" | "pending" | "failed";

/** A pending invitation as a workspace's admins see it. */
export type WorkspaceInvitationRow = { id: string; email: string; role: string; invitedBy: string; createdAt: string; expiresAt: string; mail: InvitationMailState };

/** The token in an invitation's link (32 random bytes, base64url). Anything else names no invitation. */
export const invitationTokenParam = z.string().regex(/^[A-Za-z0-9_-]{43}$/);
export const invitationTokenBody = z.object({ token: z.string({ error: "Token is required" }) }).strict();

/** What the invitation link's page shows before it is accepted. */
export type InvitationPreview = { workspace: { id: string; name: string }; role: string; invitedBy: string; email: string; expiresAt: string };

/** A pending invitation as the invited person sees it. */
export type MyInvitationRow = { id: string; workspace: { id: string; name: string }; role: string; invitedBy: string; createdAt: string; expiresAt: string };

/** An invitation id in a path (UUIDs; better-auth's ids are letters and digits). Anything else is not there. */
export const invitationIdParam = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/);

export const memberRoleBody = z.object({ role }).strict();

/** A member id in a path: ours are UUIDs, better-auth's are 32 letters and digits. Anything else is not there. */
export const memberIdParam = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/);

export const workspaceCreateBody = z
  .object({
    name: z
      .string({ error: "Name is required" })
      .trim()
      .min(1, "Name is required")
      .max(80, "Name must be at most 80 characters")
      .refine((t) => isStorableText(t), storableTextMessage("Name")),
  })
  .strict();

/** One of the caller's workspaces, with the caller's role in it. */
export type WorkspaceSummary = { id: string; name: string; slug: string; role: string };

/** A member row as the members API returns it (dates as ISO strings). */
export type MemberRow = { id: string; userId: string; name: string; email: string; role: string; createdAt: string };
