import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { ErrorNotice } from "@/components/ui/notice";
import { requireSession, type Signed } from "@/server/data/guard";
import { previewInvitation } from "@/server/data/invitations";
import { HttpError } from "@/server/http/errors";
import { AcceptInvitationButton } from "./accept-invitation-button";

export const metadata: Metadata = { title: "Invitation", robots: { index: false, follow: false } };

async function signedInOrNull(): Promise<Signed | null> {
  try {
    return await requireSession(await headers());
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) return null;
    throw error;
  }
}

/** The page an invitation message links to: who invited whom to what, and the way in for the invited address. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const [invitation, signed] = await Promise.all([previewInvitation(token), signedInOrNull()]);
  if (!invitation || invitation.status !== "open") {
    const message = !invitation
      ? "It was withdrawn, replaced by a newer invitation, or the link was copied incompletely."
      : invitation.status === "used"
        ? "It was already used: an invitation works once."
        : "It has expired. Ask whoever invited you for a new one.";
    return (
      <div className="flex flex-col gap-4">
        <h1 className="text-xl font-semibold">This invitation does not work</h1>
        <ErrorNotice title="Invitation not open" message={message} />
        <Link className="font-medium text-steel underline" href="/">Go to Knucklebench</Link>
      </div>
    );
  }
  const here = `/invitations/${token}`;
  const mine = signed?.user.email.toLowerCase() === invitation.email;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Join {invitation.workspace.name}</h1>
      <p className="text-sm">
        {invitation.invitedBy} invited <span className="font-medium">{invitation.email}</span> to the workspace{" "}
        <span className="font-medium">{invitation.workspace.name}</span> as {/^[aeiou]/i.test(invitation.role) ? "an" : "a"} {invitation.role}.
      </p>
      {mine ? (
        <AcceptInvitationButton token={token} />
      ) : signed ? (
        <>
          <ErrorNotice
            title="Signed in with another address"
            message={`You are signed in as ${signed.user.email}; this invitation is for ${invitation.email}. Sign out, then sign in or create an account with that address.`}
          />
          <SignOutButton />
        </>
      ) : (
        <div className="flex flex-col gap-2 text-sm">
          <p>Sign in with {invitation.email}, or create an account with it, to accept.</p>
          <p className="flex gap-4">
            <Link className="font-medium text-steel underline" href={`/sign-in?next=${encodeURIComponent(here)}`}>Sign in</Link>
            <Link className="font-medium text-steel underline" href={`/sign-up?next=${encodeURIComponent(here)}`}>Create an account</Link>
          </p>
        </div>
      )}
    </div>
  );
}
