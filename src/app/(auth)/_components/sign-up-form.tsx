"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { safeNextPath, signUpFields, type SignUpFields } from "@/contracts/account";
import { authClient, authFailureMessage } from "@/lib/auth-client";

export function SignUpForm({ next }: { next?: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignUpFields>({ resolver: zodResolver(signUpFields) });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const { error } = await authClient.signUp.email(values);
    if (error) {
      setFailure(authFailureMessage(error, "Could not create the account."));
      return;
    }
    router.replace(safeNextPath(next));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h1 className="text-xl font-semibold">Create your account</h1>
      <p className="text-sm text-ink-muted">You get a workspace of your own; collaborators can add you to theirs.</p>
      {failure ? <ErrorNotice title="Could not sign up" message={failure} /> : null}
      <TextField id="name" label="Name" autoComplete="name" error={formState.errors.name?.message} {...register("name")} />
      <TextField id="email" label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register("email")} />
      <TextField id="password" label="Password" type="password" autoComplete="new-password" hint="At least 8 characters" error={formState.errors.password?.message} {...register("password")} />
      <Button type="submit" busy={formState.isSubmitting}>Create account</Button>
      <p className="text-sm text-ink-muted">
        Already have an account? <Link className="font-medium text-steel underline" href="/sign-in">Sign in</Link>
      </p>
    </form>
  );
}
