import type { Metadata } from "next";
import Link from "next/link";
import { ErrorNotice } from "@/components/ui/notice";
import { ResetPasswordForm } from "../_components/reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

// better-auth's link from the reset message checks the token and lands here with it (or with an error).
export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string; error?: string }> }) {
  const { token, error } = await searchParams;
  if (!token || error) {
    return (
      <div className="flex flex-col gap-4">
        <h1 className="text-xl font-semibold">Choose a new password</h1>
        <ErrorNotice title="This link does not work" message="It has expired, was already used, or was copied incompletely. Ask for a new one." />
        <Link className="font-medium text-steel underline" href="/forgot-password">Ask for a new link</Link>
      </div>
    );
  }
  return <ResetPasswordForm token={token} />;
}
