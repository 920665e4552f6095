import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins/organization";
import { db } from "../db/client";
import { isDataStoreUnavailable } from "../db/unavailable";
import * as schema from "../db/schema";
import { authSecret, env, trustedOrigins } from "../env";
import { createPersonalWorkspace } from "../data/workspaces";
import { CLIENT_ADDRESS_HEADER } from "../http/client-address";
import { consumeRate, RESET_MAIL_RATE, VERIFY_MAIL_RATE } from "../http/rate-limit";
import { ensureOutboxWorker, queueMail, resetPasswordMail, verifyAddressMail } from "../mail";
import { ac, roles } from "./access";

/**
 * better-auth's own log lines, minus a database outage: better-auth logs that error with its whole stack and
 * then throws it on, and the route wrapper logs it once more as one warning line and answers 503.
 */
function authLog(level: "debug" | "info" | "warn" | "error", message: string, ...args: unknown[]): void {
  if (args.some(isDataStoreUnavailable)) return;
  const line = `${new Date().toISOString()} ${level.toUpperCase()} [Better Auth]: ${message}`;
  if (level === "error") console.error(line, ...args);
  else if (level === "warn") console.warn(line, ...args);
  else console.log(line, ...args);
}

export const auth = betterAuth({
  appName: "Knucklebench",
  logger: { level: "warn", log: authLog },
  baseURL: env.BETTER_AUTH_URL,
  secret: authSecret(),
  trustedOrigins: trustedOrigins(),
  database: drizzleAdapter(db, {
    provider: "pg",
    schema: {
      user: schema.users,
      session: schema.sessions,
      account: schema.accounts,
      verification: schema.verifications,
      rateLimit: schema.rateLimits,
      organization: schema.workspaces,
      member: schema.members,
      invitation: schema.invitations,
    },
  }),
  // Sign-up signs in at once and sends a link confirming the address; what the address grants (accepting an
  // invitation from the list, src/server/data/invitations.ts) waits for that confirmation.
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 8,
    maxPasswordLength: 128,
    autoSignIn: true,
    resetPasswordTokenExpiresIn: 60 * 60,
    revokeSessionsOnPasswordReset: true,
    // The answer to a reset request is the same for any address; past the per-account limit the message
    // is quietly not sent, so nobody can flood someone's mailbox through it.
    sendResetPassword: async ({ user, url }) => {
      if (!(await consumeRate(RESET_MAIL_RATE, user.id)).allowed) return;
      await queueMail({ to: user.email, ...resetPasswordMail({ name: user.name, url: withCallback(url, "/reset-password") }) });
    },
  },
  emailVerification: {
    sendOnSignUp: true,
    autoSignInAfterVerification: true,
    expiresIn: 60 * 60 * 24,
    sendVerificationEmail: async ({ user, url }, request) => {
      // A sign-up made by server code (the demo seed) has no request and confirms its address itself.
      if (!request) return;
      if (!(await consumeRate(VERIFY_MAIL_RATE, user.id)).allowed) return;
      await queueMail({ to: user.email, ...verifyAddressMail({ name: user.name, url: withCallback(url, "/") }) });
    },
  },
  // No signed cookie cache: it would let a signed-out session be replayed for its whole max-age. The guard's
  // short per-instance memo (src/server/data/guard.ts) saves the database read instead.
  session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
  // Only the address the auth route resolved (src/server/http/client-address.ts); X-Forwarded-For as sent
  // is anyone's to write. Without it better-auth pools every caller in one bucket, which fails closed.
  advanced: { ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] } },
  rateLimit: {
    // On in production by default; KB_AUTH_RATE_LIMIT forces it either way (tests switch it on).
    enabled: env.KB_AUTH_RATE_LIMIT ? env.KB_AUTH_RATE_LIMIT === "on" : env.NODE_ENV === "production",
    storage: "database",
    window: 60,
    max: 100,
    customRules: {
      "/sign-in/email": { window: 60, max: 10 },
      "/sign-up/email": { window: 60, max: 10 },
      "/request-password-reset": { window: 60, max: 5 },
      "/reset-password": { window: 60, max: 10 },
      "/send-verification-email": { window: 60, max: 5 },
    },
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "owner",
      allowUserToCreateOrganization: true,
      membershipLimit: 200,
    }),
  ],
  databaseHooks: {
    user: {
      create: {
        // Every new designer starts with a workspace of their own.
        after: async (user) => {
          await createPersonalWorkspace({ id: user.id, name: user.name });
        },
      },
    },
  },
});

/** better-auth's link with a callback page, so following it lands on a page rather than a JSON answer. */
function withCallback(url: string, callback: string): string {
  const link = new URL(url);
  if (!link.searchParams.get("callbackURL")) link.searchParams.set("callbackURL", callback);
  return link.toString();
}

// Messages left waiting by a restart or an SMTP outage go out once this instance serves anything signed in.
ensureOutboxWorker();

export type AuthSession = typeof auth.$Infer.Session;
