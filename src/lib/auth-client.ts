"use client";
import { createAuthClient } from "better-auth/react";

// Same origin as the page, so it works on whatever host name the app is reached by.
export const authClient = createAuthClient();
