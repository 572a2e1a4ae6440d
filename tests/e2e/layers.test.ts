import type { Page } from "playwright-core";
import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/*
 * The layer check as a chemist uses it: dichloromethane over 50 % w/w sodium hydroxide. Perry's
 * handbook gives 50 % NaOH 1.525 g/mL at 20 °C and the CRC Handbook dichloromethane 1.327 g/mL,
 * so the organic layer floats: the inversion a chemist must be warned about.
 */

async function pick(page: Page, picker: string, typed: string, key: string) {
  await page.getByTestId(`${picker}-search`).fill(typed);
  await page.getByTestId(`${picker}-option-${key}`).click();
  await page.getByTestId(`${picker}-chosen`).waitFor();
}

const text = (page: Page, id: string) => page.getByTestId(id).first().innerText();

describe("layer check", () => {
  it("warns of the inversion for DCM over 50 % NaOH, draws it, keeps it in the link and the recent list", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page, context } = b;
      await context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: BASE_URL });
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.getByTestId("nav-layers").click();
      await page.getByTestId("layer-answer").waitFor();
      expect(await text(page, "answer-waiting")).toMatch(/Choose the organic solvent/);

      await pick(page, "organic-0", "DCM", "dichloromethane");
      await page.getByTestId("organic-0-volume-pick-25 mL").click();
      await pick(page, "aqueous", "caustic soda", "sodium-hydroxide");
      await page.getByTestId("aqueous-concentration").fill("50 %");
      await page.getByTestId("aqueous-volume-pick-20 mL").click();

      await page.getByTestId("warning-inverted-order").waitFor();
      expect(await text(page, "answer-top")).toBe("Top layer: organic");
      expect(await text(page, "answer-bottom")).toBe("Bottom layer: aqueous");
      const answer = await text(page, "layer-answer");
      expect(answer).toContain("1.525 g/mL"); // Perry's, NaOH 50 % w/w at 20 °C
      expect(answer).toContain("1.327 g/mL"); // CRC, dichloromethane at 20 °C
      expect(answer).toContain("Clear call");
      const drawing = page.getByTestId("funnel-drawing");
      expect(await drawing.isVisible()).toBe(true);
      expect(await drawing.getAttribute("aria-label")).toMatch(/Top layer: organic, 25 mL, 1\.327 g\/mL\. Bottom layer: aqueous, 20 mL, 1\.525 g\/mL/);
      expect(await page.getByTestId("warning-halogenated").isVisible()).toBe(true);
      expect(await page.getByTestId("cautions").innerText()).toMatch(/SDS/);
      await page.getByTestId("layer-answer").scrollIntoViewIfNeeded();
      await shot(page, "layers-inversion-phone");

      // The check is in the address; sharing copies that link.
      await page.waitForFunction(() => location.search.includes("o=dichloromethane"));
      expect(new URL(page.url()).searchParams.get("c")).toBe("50%");
      await page.getByTestId("share").click();
      await page.getByTestId("share-notice").waitFor();
      const link = (await page.evaluate(() => navigator.clipboard.readText())).trim();
      expect(link).toBe(page.url());

      await page.getByTestId("form-done").click();
      await page.getByTestId("system-summary").waitFor();
      expect(await text(page, "system-summary")).toContain("DCM 25 mL · 50 % NaOH 20 mL");
      await page.evaluate(() => window.scrollTo(0, 0));
      await shot(page, "layers-answer-phone");

      // A reload (or a phone that locked) keeps the check.
      await page.reload();
      await page.getByTestId("warning-inverted-order").waitFor();
      expect(await text(page, "answer-top")).toBe("Top layer: organic");

      // Wide: the answer beside the inputs.
      await page.setViewportSize(WIDE);
      await page.getByTestId("side-rail").waitFor();
      await page.getByTestId("organic-0-chosen").waitFor();
      await shot(page, "layers-inversion-wide");

      // A new check, then the recent one is a tap away: Home → Layers → the recent check.
      await page.setViewportSize(PHONE);
      await page.getByTestId("new-check").click();
      await page.getByTestId("answer-waiting").waitFor();
      await page.getByTestId("nav-home").click();
      await page.getByTestId("nav-layers").click();
      await page.getByTestId("recent").waitFor();
      await shot(page, "layers-recent-phone");
      await page.getByTestId("recent").getByText("DCM 25 mL · 50 % NaOH 20 mL").click();
      await page.getByTestId("warning-inverted-order").waitFor();
      expect(await text(page, "answer-top")).toBe("Top layer: organic");

      // The shared link reopens the check even after the form was cleared.
      await page.getByTestId("new-check").click();
      await page.getByTestId("answer-waiting").waitFor();
      await page.goto(link);
      await page.getByTestId("warning-inverted-order").waitFor();
      expect(await text(page, "answer-bottom")).toBe("Bottom layer: aqueous");
    } finally {
      await b.close();
    }
  });

  it("answers one phase for THF and water and says how to confirm a close call", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.goto(`${BASE_URL}/layers?o=tetrahydrofuran:20&aq=water&av=20&t=20`);
      await page.getByTestId("answer-one-phase").waitFor();
      expect(await text(page, "warning-one-phase")).toMatch(/single phase/);
      // Chlorobenzene (1.106 g/mL, CRC) over 15 % w/w brine (1.109 g/mL, CRC): too close to call.
      await page.goto(`${BASE_URL}/layers?o=chlorobenzene:50&aq=sodium-chloride&c=15%25&av=50&t=20`);
      await page.getByTestId("answer-certainty").waitFor();
      expect(await text(page, "answer-certainty")).toMatch(/Too close to call/);
      await page.getByTestId("how-to-confirm").waitFor();
      expect(await text(page, "how-to-confirm")).toMatch(/drops of water/);
      await shot(page, "layers-close-phone");
    } finally {
      await b.close();
    }
  });
});

describe("solvent tables", () => {
  it("searches, sorts and shows every value with its source on a phone and a wide screen", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.getByTestId("home-solvents").click();
      await page.getByTestId("solvent-row-dichloromethane").waitFor();
      await shot(page, "solvents-phone");

      await page.getByTestId("solvent-search").fill("methylene chloride");
      await page.waitForFunction(() => document.querySelectorAll('[data-testid^="solvent-row-"]').length < 10);
      const first = page.locator('[data-testid^="solvent-row-"]').first();
      expect(await first.getAttribute("data-testid")).toBe("solvent-row-dichloromethane");
      await first.click();
      await page.getByTestId("solvent-detail").waitFor();
      expect(page.url()).toBe(`${BASE_URL}/solvents/dichloromethane`);
      const detail = await text(page, "solvent-detail");
      expect(detail).toContain("1.327 g/mL"); // CRC, 20 °C
      expect(detail).toContain("CAS 75-09-2");
      expect(detail).toMatch(/Source: CRC Handbook/);
      expect(await text(page, "solvent-guide")).toMatch(/CHEM21 category: Hazardous/);
      await shot(page, "solvent-detail-phone");

      await page.setViewportSize(WIDE);
      await page.goto(`${BASE_URL}/solvents`);
      await page.getByTestId("solvent-table").waitFor();
      await page.getByTestId("sort-density").click();
      await page.getByTestId("sort-density").click();
      const densest = page.locator('[data-testid^="solvent-row-"]').first();
      // Carbon tetrachloride, 1.594 g/mL (CRC), is the densest solvent in the tables.
      expect(await densest.getAttribute("data-testid")).toBe("solvent-row-carbon-tetrachloride");
      await page.getByTestId("solvent-row-ethyl-acetate").click();
      await page.getByTestId("solvent-detail").waitFor();
      expect(await text(page, "solvent-guide")).toMatch(/Recommended/);
      await shot(page, "solvents-wide");
    } finally {
      await b.close();
    }
  });
});

describe("a shared link opened signed out", () => {
  it("opens a shared check signed out, asks to sign in, then shows that check", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      // Toluene (0.867 g/mL, CRC) over water: the organic layer on top.
      await page.goto(`${BASE_URL}/layers?o=toluene:30&aq=water&av=30&t=20`);
      await page.getByTestId("sign-in-email").waitFor();
      expect(new URL(page.url()).searchParams.get("next")).toBe("/layers?o=toluene:30&aq=water&av=30&t=20");
      await page.getByTestId("sign-in-email").fill(DEMO.chemist.email);
      await page.getByTestId("sign-in-password").fill(DEMO.chemist.password);
      await page.getByTestId("sign-in-submit").click();
      await page.getByTestId("answer-top").waitFor();
      expect(await text(page, "answer-top")).toBe("Top layer: organic");
      expect(new URL(page.url()).pathname).toBe("/layers");
      expect(new URL(page.url()).searchParams.get("o")).toBe("toluene:30");
    } finally {
      await b.close();
    }
  });

  it("ignores a sign-in link that would send the chemist to another site", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await page.goto(`${BASE_URL}/sign-in?next=${encodeURIComponent("//elsewhere.example/steal")}`);
      await page.getByTestId("sign-in-email").fill(DEMO.chemist.email);
      await page.getByTestId("sign-in-password").fill(DEMO.chemist.password);
      await page.getByTestId("sign-in-submit").click();
      await page.getByTestId("tab-bar").waitFor();
      expect(new URL(page.url()).origin).toBe(new URL(BASE_URL).origin);
      expect(new URL(page.url()).pathname).toBe("/");
    } finally {
      await b.close();
    }
  });
});
