import fs from "node:fs";
import type { Page } from "playwright-core";
import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/*
 * The lead of the demo group curates: verifies a logged case, promotes its fix into group
 * advice, and the group's chemist then finds that note in the emulsion help. Along the way,
 * each curation section of the desk is photographed on a wide screen and on a phone.
 */

const CASE_TITLE = "Black specks holding the toluene layer after the cross-coupling";
const ASKED_CASE = "Hazy ethyl acetate layer after the brine wash";
const ASK = "How much sodium sulfate did the hazy layer take, and was it still cloudy after?";
const NOTE = "When fine solids hold the band (metal residues, salts), filter the whole mixture through a pad of diatomaceous earth first.";

async function openDesk(page: Page, section: string) {
  await page.goto(`${BASE_URL}/desk/${section}`);
  await page.getByTestId(`desk-tab-${section}`).waitFor();
}

/**
 * Every visible button on the page has a label and a size a gloved finger can hit. The shared
 * table's sort headers (40 px, a desk-only control) are left to that component's owner.
 */
async function expectUsableButtons(page: Page) {
  const small = await page.evaluate(() =>
    Array.from(document.querySelectorAll('[role="button"],[role="checkbox"],[role="radio"],[role="tab"]'))
      .filter((el) => !el.closest('[role="columnheader"]'))
      .map((el) => ({ el: el as HTMLElement, r: (el as HTMLElement).getBoundingClientRect() }))
      .filter(({ r }) => r.width > 0 && r.height > 0)
      .filter(({ el, r }) => r.height < 44 || !(el.getAttribute("aria-label") || el.innerText.trim()))
      .map(({ el, r }) => `${el.getAttribute("aria-label") ?? el.innerText.slice(0, 30)} (${Math.round(r.width)}×${Math.round(r.height)})`),
  );
  expect(small).toEqual([]);
}

/** Nothing spills past the right edge of the window (clipped tables, long titles). */
async function expectNoSideways(page: Page) {
  const over = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(over).toBeLessThanOrEqual(1);
}

describe("curation at the lead's desk", () => {
  it("the lead verifies a case, promotes its fix, bulk-verifies two more; insight and backup work", async () => {
    const b = await openBrowser(WIDE);
    try {
      const { page } = b;
      await signIn(page, DEMO.lead.email, DEMO.lead.password);
      await page.getByTestId("side-rail").waitFor();

      await openDesk(page, "review");
      await page.getByTestId("review-table").waitFor();
      const before = await page.getByTestId("review-view-all").innerText();
      const waiting = Number(/\((\d+)\)/.exec(before)?.[1]);
      expect(waiting).toBeGreaterThan(2);
      await expectNoSideways(page);
      await expectUsableButtons(page);
      await shot(page, "desk-review-wide");

      await page.getByRole("button", { name: `Review ${CASE_TITLE}` }).click();
      await page.getByTestId("review-detail").waitFor();
      expect(await page.getByTestId("review-detail").innerText()).toContain("Filtering through a pad");
      await shot(page, "desk-review-detail-wide");
      await page.getByTestId("review-verify").click();
      await page.getByTestId("review-verified").waitFor();
      // Verified cases leave the queue.
      await page.getByTestId("review-view-all").filter({ hasText: `(${waiting - 1})` }).waitFor();

      await page.getByTestId("review-promote").click();
      await page.waitForURL(/\/desk\/advice\?case=/);
      await page.getByTestId("advice-form").waitFor();
      await page.getByTestId("advice-family-any").click();
      await page.getByTestId("advice-band-any").click();
      await page.getByTestId("advice-cause-fine-solids").click();
      await page.getByTestId("advice-text").fill(NOTE);
      await shot(page, "desk-advice-form-wide");
      await page.getByTestId("advice-promote").click();
      const card = page.locator('[data-testid^="advice-note-"]').filter({ hasText: NOTE });
      await card.waitFor();
      expect(await card.innerText()).toMatch(/Filter through diatomaceous earth or glass wool/);
      expect(await card.innerText()).toMatch(/cleared \d+ of \d+/);
      expect(await card.innerText()).toContain(CASE_TITLE);
      await expectNoSideways(page);
      await expectUsableButtons(page);
      await shot(page, "desk-advice-wide");

      // Ask the author of another case for more: the request waits on the case.
      await openDesk(page, "review");
      await page.getByRole("button", { name: `Review ${ASKED_CASE}` }).click();
      await page.getByTestId("review-detail").filter({ hasText: ASKED_CASE }).waitFor();
      await page.getByTestId("request-text").fill(ASK);
      await page.getByTestId("request-send").click();
      await page.locator('[data-testid^="request-"]').filter({ hasText: ASK }).first().waitFor();
      await page.getByTestId("review-view-asked").filter({ hasText: "(1)" }).waitFor();
      await page.getByTestId("review-close").click();

      // Bulk: select the first two cases in the queue and verify them together.
      await openDesk(page, "review");
      await page.getByTestId("review-table").waitFor();
      const picks = page.locator('[data-testid^="review-pick-"]:not([data-testid="review-pick-all"])');
      await picks.nth(0).click();
      await picks.nth(1).click();
      expect(await page.getByTestId("review-bulk-verify").innerText()).toBe("Verify selected (2)");
      await shot(page, "desk-review-bulk-wide");
      await page.getByTestId("review-bulk-verify").click();
      await page.getByTestId("review-view-all").filter({ hasText: `(${waiting - 3})` }).waitFor();

      await openDesk(page, "insight");
      await page.getByTestId("insight-success").waitFor();
      expect(await page.getByTestId("insight-totals").innerText()).toMatch(/\d+ cases/);
      await page.getByTestId("insight-success-numbers").click();
      expect(await page.getByTestId("insight-success-table").innerText()).toMatch(/Filter through diatomaceous earth or glass wool: cleared \d+/);
      expect(await page.getByTestId("insight-success-bars").getAttribute("aria-label")).toMatch(/cleared \d+ of \d+/);
      await expectNoSideways(page);
      await expectUsableButtons(page);
      await shot(page, "desk-insight-wide");
      await page.getByTestId("insight-period-3").click();
      await page.getByTestId("insight-totals").waitFor();

      await openDesk(page, "backup");
      const download = page.waitForEvent("download");
      await page.getByTestId("backup-start").click();
      const file = await download;
      await page.getByTestId("backup-done").waitFor();
      expect(file.suggestedFilename()).toMatch(/^phasewise-larchmere-process-\d{4}-\d{2}-\d{2}\.json$/);
      const saved = JSON.parse(fs.readFileSync((await file.path())!, "utf8")) as { format: string; cases: unknown[]; advice: { text: string }[] };
      expect(saved.format).toBe("phasewise-group-backup");
      expect(saved.cases.length).toBeGreaterThan(10);
      expect(saved.advice.map((n) => n.text)).toContain(NOTE);
      expect(await page.getByTestId("backup-done").innerText()).toMatch(/\d+ records/);
      await expectNoSideways(page);
      await expectUsableButtons(page);
      await shot(page, "desk-backup-wide");
    } finally {
      await b.close();
    }
  });

  it("the chemist sees the group note in the emulsion help; the desk sections fit a phone", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.getByTestId("nav-emulsion").click();
      await page.getByTestId("emulsion-funnel").waitFor();
      await page.getByTestId("emulsion-solvent-0-search").fill("DCM");
      await page.getByTestId("emulsion-solvent-0-option-dichloromethane").click();
      await page.getByTestId("emulsion-organic-volume-0-pick-50 mL").click();
      await page.getByTestId("emulsion-solute-option-sodium-hydroxide-1 M").click();
      await page.getByTestId("emulsion-aqueous-volume-pick-50 mL").click();
      await page.getByTestId("emulsion-fraction-25").click();
      await page.getByTestId("emulsion-seen-flag-solids").click();
      await page.getByTestId("emulsion-show").click();
      await page.getByTestId("emulsion-results").waitFor();
      await page.getByTestId("emulsion-provenance").filter({ hasNotText: "checking" }).waitFor();
      await page.getByTestId("remedy-filter-pad-toggle").click();
      const details = page.getByTestId("remedy-filter-pad-details");
      await details.waitFor();
      const text = await details.innerText();
      expect(text).toContain("Your group's notes");
      expect(text).toContain(NOTE);
      expect(text).toContain(CASE_TITLE);
      await page.getByText(NOTE, { exact: false }).scrollIntoViewIfNeeded();
      await shot(page, "emulsion-group-note-phone");

      // A chemist may look at the desk: insight is theirs too; review shows what they were asked.
      await openDesk(page, "insight");
      await page.getByTestId("insight-success").waitFor();
      await expectNoSideways(page);
      await shot(page, "desk-insight-chemist-phone");
      // The author answers the lead's request from the desk's review tab.
      await openDesk(page, "review");
      await page.getByTestId("desk-read-only").waitFor();
      const asked = page.getByTestId("asked-of-me");
      await asked.getByText(ASK).waitFor();
      await shot(page, "desk-review-chemist-phone");
      await asked.locator('[data-testid^="request-reply-"]').fill("About 10 g; clear after 15 min.");
      await asked.locator('[data-testid^="request-answer-"]').click();
      await asked.waitFor({ state: "detached" });
      // …and the case page shows the exchange.
      await page.goto(`${BASE_URL}/cases`);
      await page.getByText(ASKED_CASE).first().click();
      await page.getByTestId("case-requests").waitFor();
      expect(await page.getByTestId("case-requests").innerText()).toContain("About 10 g; clear after 15 min.");
      await page.getByTestId("case-requests").scrollIntoViewIfNeeded();
      await shot(page, "case-request-answered-phone");
    } finally {
      await b.close();
    }

    const lead = await openBrowser(PHONE);
    try {
      const { page } = lead;
      await signIn(page, DEMO.lead.email, DEMO.lead.password);
      await page.getByTestId("tab-bar").waitFor();
      for (const section of ["review", "advice", "insight", "backup"]) {
        await openDesk(page, section);
        await page.getByTestId(`desk-tab-${section}`).waitFor();
        await page.waitForLoadState("networkidle");
        await expectNoSideways(page);
        await expectUsableButtons(page);
        await shot(page, `desk-${section}-phone`);
      }
      await openDesk(page, "review");
      await page.locator('[data-testid^="review-open-"]').first().click();
      await page.getByTestId("review-detail").waitFor();
      await expectNoSideways(page);
      await shot(page, "desk-review-detail-phone");
      await page.getByTestId("review-close").click();
      await page.getByTestId("review-table").waitFor();
    } finally {
      await lead.close();
    }
  });
});
