// Share links (a read-only link to a kit for someone outside the workspace) and comments pinned to the
// drawing: the bodies both sides send, and the answers they get.
import { z } from "zod";
import { isStorableText, PG_INTEGER_MAX, storableTextMessage } from "./text";

export const COMMENT_VIEWS = ["front", "top", "joint"] as const;
export type CommentView = (typeof COMMENT_VIEWS)[number];

export const COMMENT_BODY_MAX = 2000;
export const DISPLAY_NAME_MAX = 60;
export const SHARE_LABEL_MAX = 80;
/** Longest a share link may live: a year. */
export const SHARE_MAX_DAYS = 365;

/** A share link token in a path: 43 characters of base64url (256 random bits). Anything else is no link. */
export const SHARE_TOKEN = /^[A-Za-z0-9_-]{43}$/;

export const shareLinkCreateSchema = z
  .object({
    /** Omitted or null: the kit's head, whichever revision that is when the link is opened. */
    revision: z.number({ error: "Revision must be a whole number" }).int("Revision must be a whole number").min(1, "Revision must be at least 1").max(PG_INTEGER_MAX).nullable().optional(),
    allowComments: z.boolean({ error: "allowComments must be true or false" }).optional(),
    /** Days from now until the link stops working; omitted or null: never. */
    expiresInDays: z.number({ error: "Expiry must be a number of days" }).int("Expiry must be a whole number of days").min(1, "Expiry must be at least 1 day").max(SHARE_MAX_DAYS, `Expiry must be at most ${SHARE_MAX_DAYS} days`).nullable().optional(),
    label: z
      .string({ error: "Label must be text" })
      .trim()
      .max(SHARE_LABEL_MAX, `Label must be at most ${SHARE_LABEL_MAX} characters`)
      .refine((t) => isStorableText(t), storableTextMessage("Label"))
      .optional(),
  })
  .strict();
export type ShareLinkCreate = z.infer<typeof shareLinkCreateSchema>;

export interface ShareLinkRow {
  readonly id: string;
  readonly revision: number | null;
  readonly allowComments: boolean;
  readonly label: string;
  readonly expiresAt: string | null;
  readonly revokedAt: string | null;
  readonly createdByName: string | null;
  readonly createdAt: string;
  /** "active", or why it no longer opens. */
  readonly state: "active" | "expired" | "revoked";
}

/** The answer to making a link: the row, and the token (shown this once; only its hash is kept). */
export interface ShareLinkCreated {
  readonly link: ShareLinkRow;
  readonly token: string;
  /** The share page's path: /shared/TOKEN. */
  readonly path: string;
}

export const sharePath = (token: string) => `/shared/${token}`;

const commentBody = z
  .string({ error: "Body must be text" })
  .trim()
  .min(1, "Body must not be empty")
  .max(COMMENT_BODY_MAX, `Body must be at most ${COMMENT_BODY_MAX} characters`)
  .refine((t) => isStorableText(t, true), storableTextMessage("Body", true));

const planeMm = (axis: string) =>
  z.number({ error: `${axis} must be a number of millimetres` }).finite(`${axis} must be a finite number`).min(-10_000, `${axis} must be within ±10 000 mm`).max(10_000, `${axis} must be within ±10 000 mm`);

const pinFields = {
  revision: z.number({ error: "Revision must be a whole number" }).int("Revision must be a whole number").min(1, "Revision must be at least 1").max(PG_INTEGER_MAX),
  view: z.enum(COMMENT_VIEWS, { error: `View must be one of ${COMMENT_VIEWS.join(", ")}` }),
  xMm: planeMm("xMm"),
  yMm: planeMm("yMm"),
};
const PIN_KEYS = ["revision", "view", "xMm", "yMm"] as const;

export type CommentPin = { revision: number; view: CommentView; xMm: number; yMm: number };
/** A new thread pinned to a point of one view of a revision, or a reply (parentId) that takes its thread's pin. */
export type CommentCreate = { body: string } & ({ parentId: string } | CommentPin);
export type SharedCommentCreate = CommentCreate & { authorName: string };

/**
 * One object with every field optional, then the rule between them: so a wrong field is named in the
 * answer (a union of two shapes would only say "invalid input").
 */
function commentShape<E extends z.ZodRawShape>(extra: E) {
  return z
    .object({ body: commentBody, parentId: z.uuid("parentId must be a comment id").optional(), ...extra, ...Object.fromEntries(PIN_KEYS.map((k) => [k, pinFields[k].optional()])) as { [K in keyof typeof pinFields]: z.ZodOptional<(typeof pinFields)[K]> } })
    .strict()
    .superRefine((value, ctx) => {
      const v = value as Record<string, unknown>;
      for (const k of PIN_KEYS) {
        if (v.parentId === undefined && v[k] === undefined) ctx.addIssue({ code: "custom", path: [k], message: `${k} is needed for a new comment (or give parentId to reply)` });
        if (v.parentId !== undefined && v[k] !== undefined) ctx.addIssue({ code: "custom", path: [k], message: "A reply takes its thread's pin: leave it out" });
      }
    });
}

/** A comment from a member. */
export const commentCreateSchema = commentShape({}) as unknown as z.ZodType<CommentCreate>;

export const displayName = z
  .string({ error: "Name must be text" })
  .trim()
  .min(1, "Name must not be empty")
  .max(DISPLAY_NAME_MAX, `Name must be at most ${DISPLAY_NAME_MAX} characters`)
  .refine((t) => isStorableText(t), storableTextMessage("Name"));

/** A comment through a share link that allows comments: the reviewer's display name too. */
export const sharedCommentCreateSchema = commentShape({ authorName: displayName }) as unknown as z.ZodType<SharedCommentCreate>;

export const commentUpdateSchema = z.object({ resolved: z.boolean({ error: "resolved must be true or false" }) }).strict();

export interface CommentRow {
  readonly id: string;
  readonly revision: number;
  readonly view: CommentView;
  readonly xMm: number;
  readonly yMm: number;
  readonly parentId: string | null;
  readonly body: string;
  readonly authorName: string;
  /** True when written through a share link (no account). */
  readonly viaShareLink: boolean;
  readonly resolvedAt: string | null;
  readonly resolvedByName: string | null;
  readonly createdAt: string;
  /** Whether the caller may delete it (its author, or an editor of the workspace). */
  readonly canDelete: boolean;
}

/** A thread: the pinned comment and its replies, oldest first. */
export interface CommentThread extends CommentRow {
  readonly replies: readonly CommentRow[];
}

/** What a share link opens (GET /api/share/TOKEN). */
export interface SharedKit {
  readonly kitName: string;
  readonly workspaceName: string;
  readonly scale: string;
  readonly revision: number;
  readonly pinned: boolean;
  readonly allowComments: boolean;
  readonly expiresAt: string | null;
  readonly layout: unknown;
}
