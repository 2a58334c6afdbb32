import type { LaunchOptions } from "@playwright/test";

/**
 * Debian's chromium as every browser run here launches it (the Playwright specs and the
 * editor-drag bench): never a downloaded browser, no sandbox or GPU in the container, and nothing
 * fetched in the background.
 */
export const DEBIAN_CHROMIUM: LaunchOptions = {
  executablePath: "/usr/bin/chromium",
  args: [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
  ],
};
