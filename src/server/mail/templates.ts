import "server-only";
import { env } from "../env";

// The app's messages: each a plain-text part and an HTML part saying the same. Every name that came from a
// person (a workspace, a kit, a comment, a person's name) is escaped in the HTML, so markup in it shows as
// text; links are built from the configured public origin (BETTER_AUTH_URL), never from a request's Host.

export type MailContent = { subject: string; text: string; html: string };

/** Text made safe to place in HTML text or a quoted attribute. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

/** An absolute link on the app's public origin. `path` starts with "/". */
export function publicUrl(path: string): string {
  return new URL(path, env.BETTER_AUTH_URL).toString();
}

/** One line of a subject or a plain-text part: no line breaks a name could smuggle in. */
function oneLine(value: string, max = 120): string {
  const flat = value.replace(/[\r\n\t]+/g, " ").trim();
  return flat.length > max ? `${flat.slice(0, max - 1)}…` : flat;
}

type Block = { kind: "p"; text: string } | { kind: "quote"; text: string } | { kind: "button"; label: string; url: string };

/** Builds both parts from the same blocks; only `escapeHtml`d text reaches the HTML. */
function compose(subject: string, blocks: Block[], footer: string): MailContent {
  const text = [
    ...blocks.map((b) => (b.kind === "p" ? b.text : b.kind === "quote" ? b.text.split("\n").map((l) => `> ${l}`).join("\n") : `${b.label}:\n${b.url}`)),
    "--",
    footer,
  ].join("\n\n");
  const body = blocks
    .map((b) => {
      if (b.kind === "p") return `<p style="margin:0 0 16px">${escapeHtml(b.text)}</p>`;
      if (b.kind === "quote") return `<blockquote style="margin:0 0 16px;padding:8px 12px;border-left:3px solid #94a3b8;color:#334155;white-space:pre-wrap">${escapeHtml(b.text)}</blockquote>`;
      const href = escapeHtml(b.url);
      return `<p style="margin:0 0 16px"><a href="${href}" style="display:inline-block;padding:10px 16px;background:#1d4ed8;color:#ffffff;text-decoration:none;border-radius:6px">${escapeHtml(b.label)}</a></p>` +
        `<p style="margin:0 0 16px;font-size:13px;color:#475569">Or open this address: <a href="${href}">${href}</a></p>`;
    })
    .join("\n");
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family:system-ui,sans-serif;font-size:15px;line-height:1.5;color:#0f172a;max-width:560px;margin:0 auto;padding:24px">
<p style="margin:0 0 24px;font-weight:600">Knucklebench</p>
${body}
<hr style="border:none;border-top:1px solid #e2e8f0;margin:24px 0">
<p style="margin:0;font-size:13px;color:#475569">${escapeHtml(footer)}</p>
</body></html>`;
  return { subject, text, html };
}

const IGNORE = "If you did not ask for this, ignore this message; nothing changes.";

/** Sent at sign-up (and on request): the link confirms the address belongs to the person. */
export function verifyAddressMail(input: { name: string; url: string }): MailContent {
  return compose(
    "Confirm your e-mail address for Knucklebench",
    [
      { kind: "p", text: `Hello ${oneLine(input.name)},` },
      { kind: "p", text: "Confirm that this address is yours to finish setting up your Knucklebench account. The link works for 24 hours." },
      { kind: "button", label: "Confirm my address", url: input.url },
    ],
    IGNORE,
  );
}

/** Sent on a password reset request; the link works once, for an hour. */
export function resetPasswordMail(input: { name: string; url: string }): MailContent {
  return compose(
    "Reset your Knucklebench password",
    [
      { kind: "p", text: `Hello ${oneLine(input.name)},` },
      { kind: "p", text: "Someone asked to reset the password of the Knucklebench account with this address. The link works once, within an hour." },
      { kind: "button", label: "Choose a new password", url: input.url },
    ],
    "If you did not ask for this, ignore this message: your password stays as it is.",
  );
}

/** An invitation to a workspace: the link carries the invitation's token. */
export function invitationMail(input: { workspaceName: string; inviterName: string; role: string; url: string; expiresAt: Date }): MailContent {
  const workspace = oneLine(input.workspaceName);
  return compose(
    `${oneLine(input.inviterName, 60)} invited you to ${workspace} on Knucklebench`,
    [
      { kind: "p", text: `${oneLine(input.inviterName)} invited you to join the workspace “${workspace}” on Knucklebench as ${/^[aeiou]/i.test(input.role) ? "an" : "a"} ${input.role}.` },
      { kind: "p", text: `Open the link to accept: sign in, or create an account with this address. The invitation works once, until ${input.expiresAt.toUTCString()}.` },
      { kind: "button", label: "Open the invitation", url: input.url },
    ],
    "If you do not know this person or workspace, ignore this message; nobody joins without accepting.",
  );
}

/** A notice to a kit's people that someone commented on it (sent by the comments feature). */
export function commentNoticeMail(input: { kitName: string; authorName: string; body: string; url: string }): MailContent {
  const kit = oneLine(input.kitName);
  const excerpt = input.body.length > 600 ? `${input.body.slice(0, 599)}…` : input.body;
  return compose(
    `${oneLine(input.authorName, 60)} commented on ${kit}`,
    [
      { kind: "p", text: `${oneLine(input.authorName)} commented on the kit “${kit}”:` },
      { kind: "quote", text: excerpt },
      { kind: "button", label: "Open the kit", url: input.url },
    ],
    "You get this because you are a member of the kit's workspace.",
  );
}
