import "server-only";
import { z } from "zod";

// One place that reads process.env; every variable is documented in the README.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().url().default("postgres://knucklebench@127.0.0.1:54329/knucklebench"),
  // auto: the Neon driver for *.neon.tech hosts, node-postgres otherwise.
  DB_DRIVER: z.enum(["auto", "pg", "neon"]).default("auto"),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  // How long a request waits for a new database connection before it is answered 503 (an unreachable host
  // would otherwise hold it until the operating system gives up).
  DB_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(5_000),
  BETTER_AUTH_SECRET: z.string().min(16).optional(),
  BETTER_AUTH_URL: z.string().url().default("http://127.0.0.1:3000"),
  // Comma-separated extra origins allowed to send state-changing requests (auth and app routes).
  KB_TRUSTED_ORIGINS: z.string().default(""),
  KB_AUTH_RATE_LIMIT: z.enum(["on", "off"]).optional(),
  // Who the auth rate limit counts a request against (src/server/http/client-address.ts). By default the
  // connection's own peer address; X-Forwarded-For is read only through proxies trusted here: either how
  // many proxy hops sit in front (KB_TRUST_PROXY_HOPS) or which addresses/CIDR ranges they have
  // (KB_TRUSTED_PROXIES, comma-separated, e.g. "10.0.0.5, 192.168.0.0/16"; "loopback" etc. also work).
  KB_TRUST_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
  KB_TRUSTED_PROXIES: z.string().default(""),
  // Set by scripts/serve.mjs (`npm start`): the request header in which it records each connection's peer
  // address, replacing any copy a client sent. Unset (e.g. plain `next start`), no peer address is known.
  KB_SOCKET_ADDRESS_HEADER: z.string().regex(/^[a-z0-9-]{1,64}$/, "must be a lower-case header name").optional(),
  KB_MAX_BODY_BYTES: z.coerce.number().int().min(1024).max(10_000_000).default(262_144),
  // Object storage for uploaded files (test-run photos, underlays), reached through the AWS S3 SDK: any
  // S3-compatible provider. Unset endpoint = the provider's own (AWS S3 by region); keys unset = the SDK's
  // default chain (AWS_* variables, an instance role). Path-style addressing for providers and local
  // servers that do not serve bucket subdomains.
  KB_S3_ENDPOINT: z.string().url().optional(),
  KB_S3_REGION: z.string().min(1).default("us-east-1"),
  KB_S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "must be an S3 bucket name").default("knucklebench"),
  KB_S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  KB_S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  KB_S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  // Largest file one upload may carry (bytes); larger ones are answered 413 before anything is stored.
  KB_MAX_UPLOAD_BYTES: z.coerce.number().int().min(1024).max(100_000_000).default(10_485_760),
  // E-mail (verification, password reset, invitations, notices) over SMTP through nodemailer: any provider's
  // SMTP relay. Unset host: nothing is sent, messages wait in the outbox (mail_outbox) and a warning is
  // logged. KB_SMTP_SECURE=true for implicit TLS (port 465); false upgrades with STARTTLS when offered.
  KB_SMTP_HOST: z.string().min(1).optional(),
  KB_SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  KB_SMTP_SECURE: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  KB_SMTP_USER: z.string().min(1).optional(),
  KB_SMTP_PASSWORD: z.string().min(1).optional(),
  KB_MAIL_FROM: z.string().min(3).default("Knucklebench <no-reply@knucklebench.invalid>"),
  // The local mail catcher's API (scripts/lib/mail-catcher.sh sets both): turns on the mail page, where the
  // demo's people read what was sent. Only with a catcher on loopback; with a real provider the page is off.
  KB_MAIL_INBOX_URL: z.string().url().optional(),
  KB_MAIL_INBOX_TOKEN: z.string().min(1).optional(),
});

export type Env = z.infer<typeof envSchema>;

const checkedEnvSchema = envSchema
  .refine((e) => !(e.KB_TRUST_PROXY_HOPS > 0 && e.KB_TRUSTED_PROXIES.trim()), {
    message: "set KB_TRUST_PROXY_HOPS or KB_TRUSTED_PROXIES, not both",
    path: ["KB_TRUSTED_PROXIES"],
  })
  .refine((e) => !e.KB_S3_ACCESS_KEY_ID === !e.KB_S3_SECRET_ACCESS_KEY, {
    message: "set both KB_S3_ACCESS_KEY_ID and KB_S3_SECRET_ACCESS_KEY, or neither",
    path: ["KB_S3_SECRET_ACCESS_KEY"],
  })
  .refine((e) => !e.KB_SMTP_USER === !e.KB_SMTP_PASSWORD, {
    message: "set both KB_SMTP_USER and KB_SMTP_PASSWORD, or neither",
    path: ["KB_SMTP_PASSWORD"],
  })
  .refine((e) => !e.KB_MAIL_INBOX_URL || (isLoopback(new URL(e.KB_MAIL_INBOX_URL).hostname) && isLoopback(e.KB_SMTP_HOST ?? "")), {
    message: "the mail page reads only a local mail catcher: KB_MAIL_INBOX_URL and KB_SMTP_HOST must both be on loopback",
    path: ["KB_MAIL_INBOX_URL"],
  });

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "[::1]" || host === "::1" || /^127\.\d+\.\d+\.\d+$/.test(host);
}

function readEnv(): Env {
  const parsed = checkedEnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment:\n${lines}`);
  }
  return parsed.data;
}

export const env = readEnv();

const DEV_SECRET = "knucklebench-development-secret-not-for-production";

export function authSecret(): string {
  if (env.BETTER_AUTH_SECRET) return env.BETTER_AUTH_SECRET;
  if (env.NODE_ENV === "production" && process.env.NEXT_PHASE !== "phase-production-build") {
    throw new Error("BETTER_AUTH_SECRET must be set (at least 16 characters) when NODE_ENV=production");
  }
  return DEV_SECRET;
}

/**
 * Origins allowed to send state-changing requests, to the auth routes (better-auth's trustedOrigins) and to
 * every app write route (src/server/http/route.ts): the app's own origin, its localhost ↔ 127.0.0.1 twin
 * (the same server is reached by either name), and KB_TRUSTED_ORIGINS.
 */
export function trustedOrigins(): string[] {
  const base = new URL(env.BETTER_AUTH_URL);
  const origins = new Set([base.origin]);
  if (base.hostname === "127.0.0.1") origins.add(base.origin.replace("127.0.0.1", "localhost"));
  if (base.hostname === "localhost") origins.add(base.origin.replace("localhost", "127.0.0.1"));
  for (const o of env.KB_TRUSTED_ORIGINS.split(",").map((s) => s.trim()).filter(Boolean)) origins.add(o);
  return [...origins];
}
