import { execSync } from "node:child_process";
import { existsSync } from "node:fs";

export const CHROMIUM_PATH = "/usr/bin/chromium";

/**
 * Browser tests use Debian's Chromium, never a downloaded browser. When it is missing and we
 * are root, install it with apt-get; otherwise say exactly what to install.
 */
export function ensureChromium(): void {
  if (existsSync(CHROMIUM_PATH)) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (!isRoot) {
    console.error(
      `Browser tests need Debian's Chromium at ${CHROMIUM_PATH}.\n` +
        "Install it as root:  apt-get update && apt-get install -y chromium\nthen run npm test again.",
    );
    process.exit(1);
  }
  console.log("Installing Debian's chromium package for the browser tests …");
  execSync("apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium", { stdio: "inherit" });
  if (!existsSync(CHROMIUM_PATH)) {
    console.error(`apt-get finished but ${CHROMIUM_PATH} is still missing.`);
    process.exit(1);
  }
}
