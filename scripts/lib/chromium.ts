// How the project launches Debian's Chromium through playwright-core (no browser download): shared by the
// browser tests and the browser benchmark so both measure the same browser the same way.
import type { LaunchOptions } from "playwright-core";

const isRoot = process.getuid?.() === 0;

export const chromiumLaunchOptions: LaunchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  headless: true,
  // Quiet and offline: without these Chromium keeps reaching for the network (updates, sync, QUIC).
  // Playwright itself gives every launch a fresh --user-data-dir in a temp folder and removes it after.
  args: [
    "--headless=new",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    // Chromium's sandbox needs user namespaces a root process in CI does not get.
    ...(isRoot ? ["--no-sandbox"] : []),
  ],
};
