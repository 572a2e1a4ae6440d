// Finds Debian's Chromium for the browser tests; installs it with apt-get when missing and we are root.
import { existsSync } from "node:fs";
import { spawnSync } from "node:child_process";

export function ensureChromium() {
  const path = process.env.PHASEWISE_CHROMIUM ?? "/usr/bin/chromium";
  if (existsSync(path)) return path;
  if (process.getuid && process.getuid() === 0) {
    console.log("Chromium is missing: installing Debian's chromium with apt-get…");
    const update = spawnSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
    const install = spawnSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit" });
    if (update.status === 0 && install.status === 0 && existsSync(path)) return path;
  }
  console.error(
    `The browser tests need Chromium at ${path}. Install it with "sudo apt-get install -y chromium", or set PHASEWISE_CHROMIUM to its path.`,
  );
  process.exit(1);
}
