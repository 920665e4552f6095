import { z } from "zod";

const email = z.string().trim().toLowerCase().min(1, "E-mail is required").email("Enter a valid e-mail address").max(254);

export const signInFields = z.object({
  email,
  password: z.string().min(1, "Password is required"),
});
export type SignInFields = z.infer<typeof signInFields>;

export const signUpFields = z.object({
  name: z.string().trim().min(1, "Name is required").max(80, "Name must be at most 80 characters"),
  email,
  password: z.string().min(8, "Use at least 8 characters").max(128, "Use at most 128 characters"),
});
export type SignUpFields = z.infer<typeof signUpFields>;

/** Only same-site paths may be a post-sign-in destination (no open redirects). */
export function safeNextPath(next: string | null | undefined, fallback = "/kits"): string {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return fallback;
  return next;
}

export const forgotPasswordFields = z.object({ email });
export type ForgotPasswordFields = z.infer<typeof forgotPasswordFields>;

export const resetPasswordFields = z
  .object({
    password: z.string().min(8, "At least 8 characters").max(128, "At most 128 characters"),
    repeat: z.string().min(1, "Repeat the new password"),
  })
  .refine((v) => v.password === v.repeat, { message: "The two passwords differ", path: ["repeat"] });
export type ResetPasswordFields = z.infer<typeof resetPasswordFields>;
