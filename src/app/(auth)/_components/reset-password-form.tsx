"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { resetPasswordFields, type ResetPasswordFields } from "@/contracts/account";
import { authClient, authFailureMessage } from "@/lib/auth-client";

export function ResetPasswordForm({ token }: { token: string }) {
  const [failure, setFailure] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const { register, handleSubmit, formState } = useForm<ResetPasswordFields>({ resolver: zodResolver(resetPasswordFields) });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const { error } = await authClient.resetPassword({ newPassword: values.password, token });
    if (error) {
      setFailure(error.status === 400 ? "This link has expired or was already used. Ask for a new one." : authFailureMessage(error, "Could not change the password."));
      return;
    }
    setDone(true);
  });

  if (done) {
    return (
      <div className="flex flex-col gap-4" role="status">
        <h1 className="text-xl font-semibold">Password changed</h1>
        <p className="text-sm">Your new password is set, and every session signed in with the old one has ended.</p>
        <Link className="font-medium text-steel underline" href="/sign-in">Sign in</Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Choose a new password</h1>
      {failure ? <ErrorNotice title="Could not change the password" message={failure} /> : null}
      <TextField id="password" label="New password" type="password" autoComplete="new-password" hint="At least 8 characters" error={formState.errors.password?.message} {...register("password")} />
      <TextField id="repeat" label="New password again" type="password" autoComplete="new-password" error={formState.errors.repeat?.message} {...register("repeat")} />
      <Button type="submit" busy={formState.isSubmitting}>Change the password</Button>
      <p className="text-sm text-ink-muted"><Link className="font-medium text-steel underline" href="/forgot-password">Ask for a new link</Link></p>
    </form>
  );
}
