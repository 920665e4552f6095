"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { forgotPasswordFields, type ForgotPasswordFields } from "@/contracts/account";
import { authClient, authFailureMessage } from "@/lib/auth-client";

export function ForgotPasswordForm() {
  const [failure, setFailure] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<ForgotPasswordFields>({ resolver: zodResolver(forgotPasswordFields) });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const { error } = await authClient.requestPasswordReset({ email: values.email, redirectTo: "/reset-password" });
    if (error) {
      setFailure(authFailureMessage(error, "Could not send the message."));
      return;
    }
    setSentTo(values.email);
  });

  if (sentTo) {
    return (
      <div className="flex flex-col gap-4" role="status">
        <h1 className="text-xl font-semibold">Check your e-mail</h1>
        <p className="text-sm">
          If an account uses <span className="font-medium">{sentTo}</span>, a message with a link to choose a new password is on its way. The link works once, within an hour.
        </p>
        <p className="text-sm text-ink-muted"><Link className="font-medium text-steel underline" href="/sign-in">Back to sign in</Link></p>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Reset your password</h1>
      <p className="text-sm text-ink-muted">Give the address you signed up with; we send it a link to choose a new password.</p>
      {failure ? <ErrorNotice title="Could not send the message" message={failure} /> : null}
      <TextField id="email" label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register("email")} />
      <Button type="submit" busy={formState.isSubmitting}>Send the link</Button>
      <p className="text-sm text-ink-muted"><Link className="font-medium text-steel underline" href="/sign-in">Back to sign in</Link></p>
    </form>
  );
}
