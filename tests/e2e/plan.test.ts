import type { Page } from "playwright-core";
import { DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/*
 * A chemist of the fictional Larchmere group plans the work-up of a crude amination in ethyl
 * acetate: a tertiary amine taken from the pKa table, a carboxylic acid side product and the
 * neutral ketone product, washed with 1 M HCl (twice), saturated bicarbonate and brine. The plan
 * is computed in the browser as it is typed, saved for the group and printed as a bench card.
 */

async function pickSolute(page: Page, wash: number, typed: string, option: string) {
  await page.getByTestId(`plan-wash-${wash}-solute-search`).fill(typed);
  await page.getByTestId(`plan-wash-${wash}-solute-option-${option}`).click();
}

async function buildPlan(page: Page) {
  await page.getByTestId("plan-solvent-search").fill("EtOAc");
  await page.getByTestId("plan-solvent-option-ethyl-acetate").click();
  await page.getByTestId("plan-volume").fill("60 mL");

  // 1: a base from the pKa table
  await page.getByTestId("plan-add-component").click();
  await page.getByTestId("plan-component-0-kind-base").click();
  await page.getByTestId("plan-component-0-pka-open").click();
  await page.getByTestId("plan-component-0-pka-table-search").fill("Et3N");
  await page.getByTestId("plan-component-0-pka-table-option-triethylamine").click();
  await page.getByTestId("plan-component-0-partition").fill("30");
  await page.getByTestId("plan-component-0-amount").fill("2.5");
  // 2: an acid typed in
  await page.getByTestId("plan-add-component").click();
  await page.getByTestId("plan-component-1-name").fill("heptanoic acid");
  await page.getByTestId("plan-component-1-kind-acid").click();
  await page.getByTestId("plan-component-1-pka").fill("4.9");
  await page.getByTestId("plan-component-1-partition").fill("200");
  await page.getByTestId("plan-component-1-amount").fill("1.5");
  // 3: the neutral product, K from log P
  await page.getByTestId("plan-add-component").click();
  await page.getByTestId("plan-component-2-name").fill("ketone product");
  await page.getByTestId("plan-component-2-partition-mode-logP").click();
  await page.getByTestId("plan-component-2-partition").fill("1.9");
  await page.getByTestId("plan-component-2-amount").fill("6");

  await page.getByTestId("plan-add-wash").click();
  await pickSolute(page, 0, "1 M HCl", "hydrochloric-acid-1 M");
  await page.getByTestId("plan-wash-0-volume").fill("25 mL");
  await page.getByTestId("plan-wash-0-repeats-2").click();
  await page.getByTestId("plan-add-wash").click();
  await pickSolute(page, 1, "sat. NaHCO3", "sodium-bicarbonate");
  await page.getByTestId("plan-wash-1-volume").fill("25 mL");
  await page.getByTestId("plan-wash-1-repeats-2").click();
  await page.getByTestId("plan-add-wash").click();
  await pickSolute(page, 2, "brine", "sodium-chloride");
  await page.getByTestId("plan-wash-2-volume").fill("25 mL");
}

describe("extraction plan", () => {
  it("builds a three-wash plan at the phone, sees it computed, saves it and opens its bench card", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.getByTestId("nav-plan").click();
      await page.getByTestId("plan-empty").waitFor();
      await buildPlan(page);

      // the name came with the pKa from the table, and the source shows under it
      expect(await page.getByTestId("plan-component-0-name").inputValue()).toBe("triethylamine");
      await page.getByText(/From the pKa table: triethylamine: pKa 10\.75/).waitFor();
      await page.getByTestId("plan-organic").scrollIntoViewIfNeeded();
      await shot(page, "plan-builder-phone");

      await page.getByTestId("plan-results").waitFor();
      // five passes: HCl ×2, bicarbonate ×2, brine
      for (const key of ["0.1", "0.2", "1.1", "1.2", "2.1"]) await page.getByTestId(`plan-step-${key}`).waitFor();
      const answer = await page.getByTestId("plan-answer").innerText();
      expect(answer).toMatch(/triethylamine/);
      expect(answer).toMatch(/ketone product/);
      // the amine is washed out by the acid; the text equivalent of its bar says so
      expect(await page.getByTestId("plan-bar-0").getAttribute("aria-label")).toMatch(/triethylamine: < 0\.1 % stays in the organic layer; wash 1 \(1 M hydrochloric acid\) takes > 99\.9 %/);
      expect(await page.getByTestId("plan-step-0.1").innerText()).toMatch(/organic on top/);
      await page.getByTestId("plan-answer").scrollIntoViewIfNeeded();
      await shot(page, "plan-results-phone");
      await page.getByTestId("plan-ph").scrollIntoViewIfNeeded();
      expect(await page.getByTestId("plan-ph-chart").getAttribute("aria-label")).toMatch(/pH 0\.0 \(wash 1\), pH 8\.3 \(wash 2\), pH 7\.0 \(wash 3\)/);
      await shot(page, "plan-charts-phone");
      expect(await page.getByTestId("plan-funnel-size").innerText()).toBe("125 mL");

      // recovery of the acid from its bicarbonate extract, with the venting caution
      await page.getByTestId("plan-recovery").scrollIntoViewIfNeeded();
      const acidChip = page.getByTestId("plan-recovery-component").getByRole("button", { name: "heptanoic acid" });
      await acidChip.click();
      await page.getByTestId("plan-recovery-answer").waitFor();
      expect(await page.getByTestId("plan-recovery-co2").innerText()).toMatch(/vent/i);
      await shot(page, "plan-recovery-phone");
      await page.getByTestId("plan-evaporation-answer").waitFor();
      expect(await page.getByTestId("plan-evaporation-answer").innerText()).toMatch(/Ethyl acetate boils at 30 °C/);

      // nothing is lost on a reload
      await page.reload();
      await page.getByTestId("plan-restored").waitFor();
      await page.getByTestId("plan-step-2.1").waitFor();

      await page.getByTestId("plan-title").fill("Amination work-up, batch 12");
      await page.getByTestId("plan-save-button").click();
      await page.getByText("Amination work-up, batch 12").first().waitFor();
      await page.getByTestId("plan-delete").waitFor();

      await page.getByTestId("plan-open-card").first().click();
      await page.getByTestId("bench-card").waitFor();
      const card = await page.getByTestId("bench-card").innerText();
      expect(card).toMatch(/Amination work-up, batch 12/);
      expect(card).toMatch(/60 mL Ethyl acetate \(EtOAc\)/);
      expect(card).toMatch(/125 mL funnel/);
      expect(card).toMatch(/Drain the lower aqueous layer into the wash 1 extract flask/);
      expect(card).toMatch(/Recover heptanoic acid/);
      expect(card).toMatch(/follow the SDS, your local rules and your supervisor/);
      for (const key of ["0.1", "0.2", "1.1", "1.2", "2.1"]) await page.getByTestId(`bench-step-${key}`).waitFor();
      await shot(page, "plan-card-phone");
      expect(await page.getByTestId("bench-print").isVisible()).toBe(true);

      // the lead's demo plan: the chemist reads it and may copy it, but not change it
      await page.getByTestId("nav-plan").click();
      await page.getByText("Reductive amination: amine into acid, back out with base").click();
      await page.getByTestId("plan-read-only").waitFor();
      expect(await page.getByTestId("plan-save-button").count()).toBe(0);
      expect(await page.getByTestId("plan-recovery").innerText()).toMatch(/Warms by about \d+ °C/);
      await shot(page, "plan-shared-phone");
    } finally {
      await b.close();
    }
  });

  it("lays the builder beside its results on a wide screen, and the bench card fits one printed page", async () => {
    const b = await openBrowser(WIDE);
    try {
      const { page } = b;
      await signIn(page, DEMO.lead.email, DEMO.lead.password);
      await page.getByTestId("side-rail").waitFor();
      await page.getByTestId("nav-plan").click();
      await page.getByTestId("plan-saved").waitFor();
      await page.getByTestId("plan-load-example").click();
      await page.getByTestId("plan-results").waitFor();
      await shot(page, "plan-builder-wide");
      await page.getByTestId("plan-steps").scrollIntoViewIfNeeded();
      await shot(page, "plan-results-wide");

      await page.getByTestId("plan-open-card").click();
      await page.getByTestId("bench-card").waitFor();
      await shot(page, "plan-card-wide");
      await page.emulateMedia({ media: "print" });
      expect(await page.getByTestId("side-rail").isVisible()).toBe(false);
      expect(await page.getByTestId("bench-actions").isVisible()).toBe(false);
      const pdf = await page.pdf({ format: "A4", printBackground: true });
      // one page: a PDF lists one "/Type /Page" object per page
      expect((pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length).toBe(1);
      await shot(page, "plan-card-print");

      // solvent choice from the plan: the ranked list and substitutes with the layer-flip caveat
      await page.emulateMedia({ media: "screen" });
      await page.getByTestId("bench-back").click();
      await page.getByTestId("plan-open-solvent-choice").click();
      await page.getByTestId("choice-ranked").waitFor();
      await page.getByTestId("choice-layer-bottom").click();
      await shot(page, "plan-solvent-choice-ranked-wide");
      await page.getByTestId("choice-subs-dichloromethane").click();
      await page.getByTestId("choice-sub-ethyl-acetate").waitFor();
      expect(await page.getByTestId("choice-sub-ethyl-acetate").innerText()).toMatch(/layer order flips/);
      await page.getByTestId("choice-substitutes").evaluate((el) => el.scrollIntoView({ block: "start" }));
      await shot(page, "plan-solvent-choice-wide");
    } finally {
      await b.close();
    }
  });
});
