import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/*
 * A chemist of the demo group at the funnel: 50 mL dichloromethane over 50 mL 1 M NaOH after a
 * saponification left a fatty acid, a quarter of the volume emulsified, solids in the band.
 */
describe("emulsion help", () => {
  it("walks the questions on a phone, ranks the remedies, folds out steps, starts a case; side by side on a wide screen", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();
      await page.getByTestId("nav-emulsion").click();
      await page.getByTestId("emulsion-funnel").waitFor();
      expect(page.url()).toBe(`${BASE_URL}/emulsion`);
      await shot(page, "emulsion-questions-phone");

      await page.getByTestId("emulsion-solvent-0-search").fill("DCM");
      await page.getByTestId("emulsion-solvent-0-option-dichloromethane").click();
      await page.getByTestId("emulsion-organic-volume-0-pick-50 mL").click();
      await page.getByTestId("emulsion-solute-option-sodium-hydroxide-1 M").click();
      await page.getByTestId("emulsion-aqueous-volume-pick-50 mL").click();
      await page.getByTestId("emulsion-fraction-25").click();
      await page.getByTestId("emulsion-seen-flag-solids").click();
      await page.getByTestId("emulsion-reagent-fatty-acid").click();
      await page.getByTestId("emulsion-funnel-size-250").click();
      await page.getByTestId("emulsion-seen").scrollIntoViewIfNeeded();
      await shot(page, "emulsion-answered-phone");
      await page.getByTestId("emulsion-more-reagents").click();
      await page.getByTestId("emulsion-product-kind-neutral").click();
      await page.getByTestId("emulsion-product-logp").fill("2.5");
      await page.getByTestId("emulsion-known").scrollIntoViewIfNeeded();
      await shot(page, "emulsion-known-phone");
      await page.getByTestId("emulsion-show").scrollIntoViewIfNeeded();
      await shot(page, "emulsion-known-end-phone");

      await page.getByTestId("emulsion-show").click();
      await page.getByTestId("emulsion-results").waitFor();
      // the server's answer (with the group's cases) replaces the one computed on the phone
      await page.getByTestId("emulsion-provenance").filter({ hasNotText: "checking" }).waitFor();
      expect(await page.getByTestId("emulsion-provenance").innerText()).toMatch(/your group/i);
      expect(await page.getByTestId("emulsion-layers").innerText()).toBe("Bottom layer: organic — Dichloromethane, 1.327 g/mL");
      expect(await page.getByTestId("cause-chlorinated-base").isVisible()).toBe(true);
      expect(await page.getByTestId("cause-fine-solids").innerText()).toMatch(/solids seen at the interface/i);
      // solids seen: the filter pad is the first card
      const first = page.locator('[data-testid^="remedy-"][data-testid$="-toggle"]').first();
      expect(await first.getAttribute("data-testid")).toBe("remedy-filter-pad-toggle");
      await shot(page, "emulsion-results-phone");

      await page.getByTestId("remedy-filter-pad-toggle").click();
      await page.getByTestId("remedy-filter-pad-details").waitFor();
      expect(await page.getByTestId("remedy-filter-pad-details").innerText()).toMatch(/Rinse the pad with 10 mL/);
      await page.getByTestId("remedy-filter-pad-details").scrollIntoViewIfNeeded();
      await shot(page, "emulsion-steps-phone");

      await page.getByTestId("emulsion-more-remedies").click();
      await page.getByTestId("remedy-saturated-brine-after").scrollIntoViewIfNeeded();
      expect(await page.getByTestId("remedy-saturated-brine-after").innerText()).toBe(
        "After 13 mL saturated brine: organic still on the bottom, Δρ 0.253 g/mL, funnel 45 % full",
      );
      await shot(page, "emulsion-after-line-phone");
      await page.getByTestId("emulsion-ruled-out").scrollIntoViewIfNeeded();
      expect(await page.getByTestId("remedy-warm-bath-warning").innerText()).toMatch(/Do not warm: dichloromethane boils at 39.6 °C/);
      await shot(page, "emulsion-ruled-out-phone");

      await page.getByTestId("emulsion-start-case").scrollIntoViewIfNeeded();
      await page.getByTestId("emulsion-start-case").click();
      await page.waitForURL(/\/cases\/new\?system=/);
      const prefill = JSON.parse(new URL(page.url()).searchParams.get("system") ?? "{}");
      expect(prefill.organic).toEqual([{ solvent: "dichloromethane", volumeMl: 50 }]);
      expect(prefill.seen).toEqual({ emulsionFractionPct: 25, solids: true });
      await page.getByText("Dichloromethane").first().waitFor();
      await shot(page, "emulsion-case-prefilled-phone");
      await page.goBack();

      // wide: questions and answer side by side; the answers came back from the local draft
      await page.setViewportSize(WIDE);
      await page.getByTestId("side-rail").waitFor();
      await page.getByTestId("emulsion-results").waitFor();
      expect(await page.getByTestId("emulsion-system-summary").innerText()).toBe("DCM 50 mL · 1 M NaOH 50 mL");
      await shot(page, "emulsion-wide");

      // start over, then one tap brings the recent system back
      await page.getByTestId("emulsion-start-over").click();
      await page.getByTestId("emulsion-solvent-0-search").waitFor();
      await page.getByTestId("emulsion-start-recent-0").click();
      expect(await page.getByTestId("emulsion-system-summary").innerText()).toBe("DCM 50 mL · 1 M NaOH 50 mL");
      await page.getByTestId("emulsion-results").waitFor();
      await shot(page, "emulsion-wide-recent");
    } finally {
      await b.close();
    }
  });
});
