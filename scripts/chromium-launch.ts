import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext } from "playwright-core";

/*
 * Headless Debian Chromium as the browser tests and the bundle bench start it: a fresh profile
 * each time, and no background networking (this machine's closed network refuses it).
 */
const ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

/** A persistent context on a new empty profile (launch() refuses --user-data-dir). */
export async function launchChromium(viewport: { width: number; height: number }, profilePrefix = "phasewise-chromium-"): Promise<{ context: BrowserContext; profile: string }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), profilePrefix));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.PHASEWISE_CHROMIUM ?? "/usr/bin/chromium",
    viewport,
    args: ARGS,
  });
  return { context, profile };
}
