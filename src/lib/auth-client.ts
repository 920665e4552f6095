"use client";
import { createAuthClient } from "better-auth/react";
import { DATA_STORE_UNAVAILABLE_MESSAGE } from "@/contracts/data-store";

// Same origin as the page, so it works on whatever host name the app is reached by.
export const authClient = createAuthClient();

/**
 * What a failed sign-in or sign-up says. The auth routes answer an outage with the app's own 503 body
 * (`{ error: { … } }`), which better-auth's client does not read, so the status speaks for it.
 */
export function authFailureMessage(error: { status: number; message?: string }, fallback: string): string {
  if (error.status === 429) return "Too many attempts. Wait a minute and try again.";
  if (error.status === 503) return DATA_STORE_UNAVAILABLE_MESSAGE;
  return error.message || fallback;
}
