"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { safeNextPath, signInFields, type SignInFields } from "@/contracts/account";
import { authClient, authFailureMessage } from "@/lib/auth-client";

export function SignInForm({ next }: { next?: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInFields>({ resolver: zodResolver(signInFields) });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const { error } = await authClient.signIn.email(values);
    if (error) {
      setFailure(authFailureMessage(error, "Those details did not match an account."));
      return;
    }
    router.replace(safeNextPath(next));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Sign in</h1>
      {failure ? <ErrorNotice title="Could not sign in" message={failure} /> : null}
      <TextField id="email" label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register("email")} />
      <TextField id="password" label="Password" type="password" autoComplete="current-password" error={formState.errors.password?.message} {...register("password")} />
      <Button type="submit" busy={formState.isSubmitting}>Sign in</Button>
      <p className="text-sm text-ink-muted">
        <Link className="font-medium text-steel underline" href="/forgot-password">Forgot your password?</Link>
      </p>
      <p className="text-sm text-ink-muted">
        New here? <Link className="font-medium text-steel underline" href={next ? `/sign-up?next=${encodeURIComponent(next)}` : "/sign-up"}>Create an account</Link>
      </p>
    </form>
  );
}
