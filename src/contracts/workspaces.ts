import { z } from "zod";
import { WORKSPACE_ROLES } from "./roles";
import { isStorableText, storableTextMessage } from "./text";

const role = z.enum(WORKSPACE_ROLES, { error: `Role must be one of ${WORKSPACE_ROLES.join(", ")}` });

export const memberAddBody = z
  .object({
    email: z.string({ error: "E-mail is required" }).trim().toLowerCase().email("Enter a valid e-mail address").max(254),
    role,
  })
  .strict();
export type MemberAddBody = z.infer<typeof memberAddBody>;

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
