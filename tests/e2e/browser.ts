import fs from "node:fs";
import path from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { launchChromium } from "../../scripts/chromium-launch";

export const BASE_URL = process.env.PHASEWISE_E2E_URL ?? "";
export const SHOTS_DIR = path.join(__dirname, "..", "..", "build", "screenshots");

if (!BASE_URL) throw new Error("Run the browser tests through `npm run test:e2e` (it starts the server).");

export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1280, height: 800 };

/** A fresh Chromium profile per call (launch() refuses --user-data-dir; use a persistent context). */
export async function openBrowser(viewport = PHONE): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const { context, profile: dir } = await launchChromium(viewport);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

export async function shot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS_DIR, `${name}.png`) });
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByTestId("sign-in-email").fill(email);
  await page.getByTestId("sign-in-password").fill(password);
  await page.getByTestId("sign-in-submit").click();
}

export const DEMO = {
  owner: { email: "owner@larchmere.example", password: "larchmere-owner-1" },
  lead: { email: "lead@larchmere.example", password: "larchmere-lead-1" },
  chemist: { email: "chemist@larchmere.example", password: "larchmere-chemist-1" },
};
