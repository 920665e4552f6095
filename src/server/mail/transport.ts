import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../env";

let transporter: Transporter | null | undefined;
let warned = false;

/** The SMTP transport from KB_SMTP_*, or null when no SMTP server is configured (messages then wait). */
export function smtpTransport(): Transporter | null {
  if (transporter !== undefined) return transporter;
  if (!env.KB_SMTP_HOST) {
    if (!warned) console.warn("mail: KB_SMTP_HOST is not set; messages wait in the outbox (mail_outbox) until it is");
    warned = true;
    return null;
  }
  transporter = nodemailer.createTransport({
    host: env.KB_SMTP_HOST,
    port: env.KB_SMTP_PORT,
    secure: env.KB_SMTP_SECURE,
    auth: env.KB_SMTP_USER ? { user: env.KB_SMTP_USER, pass: env.KB_SMTP_PASSWORD } : undefined,
    // A request may wait on the first attempt: an unreachable server must not hold it for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return transporter;
}

export function mailFrom(): string {
  return env.KB_MAIL_FROM;
}
