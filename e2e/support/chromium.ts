// Debian's Chromium, never a downloaded browser, for the e2e tests and the UI
// bench alike. The flags keep it from calling home: this machine's network is
// closed beyond loopback.
import type { LaunchOptions } from "@playwright/test";

export const chromiumLaunchOptions: LaunchOptions = {
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
