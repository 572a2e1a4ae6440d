import zlib from "node:zlib";
import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/** A real, decodable PNG built byte by byte: two bands, orange over teal, like a funnel photo. */
function bandedPng(width = 24, height = 32): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(zlib.crc32(body) >>> 0);
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour RGB
  const rows: Buffer[] = [];
  for (let y = 0; y < height; y++) {
    const row = Buffer.alloc(1 + width * 3); // filter byte 0, then RGB
    const [r, g, b] = y < height / 2 ? [217, 142, 43] : [44, 140, 153];
    for (let x = 0; x < width; x++) row.set([r, g, b], 1 + x * 3);
    rows.push(row);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", zlib.deflateSync(Buffer.concat(rows))),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

const TITLE = "Milky band after the bicarbonate wash of the coupling crude";

describe("case log", () => {
  it("logs a case with a photo, adds two attempts, and finds it again by a solvent synonym", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, DEMO.chemist.password);
      await page.getByTestId("tab-bar").waitFor();

      await page.getByTestId("nav-cases").click();
      await page.getByTestId("cases-search").waitFor();
      await page.getByTestId("cases-new").first().click();
      await page.getByTestId("organic-0-solvent-search").waitFor();

      // The system, mostly by taps.
      await page.getByTestId("organic-0-solvent-search").fill("dichloromethane");
      await page.getByTestId("organic-0-solvent-option-dichloromethane").click();
      // CRC Handbook: dichloromethane 1.3266 g/mL at 20 °C, shown to 3 decimals.
      expect(await page.getByTestId("organic-0-solvent-chosen").innerText()).toContain("1.327 g/mL at 20 °C");
      await page.getByTestId("organic-0-volume-pick-50 mL").click();
      await page.getByTestId("aqueous-solute-option-sodium-bicarbonate-saturated").click();
      await page.getByTestId("aqueous-volume-pick-50 mL").click();
      await page.getByTestId("observed-organic").click();
      await page.getByTestId("kind-milky-band").click();
      await page.getByTestId("emulsion-pct").fill("20");
      // Dichloromethane (1.327) over saturated bicarbonate (~1.06): organic at the bottom.
      await page.getByText(/^Predicted: organic at the bottom/).waitFor();
      await page.getByTestId("case-title").fill(TITLE);

      // A photo through the picker: expo-image-picker opens a file input on the web.
      const [chooser] = await Promise.all([page.waitForEvent("filechooser"), page.getByTestId("photo-library").click()]);
      await chooser.setFiles({ name: "interface.png", mimeType: "image/png", buffer: bandedPng() });
      await page.getByText("Uploads when the case is saved").waitFor();
      await page.getByRole("heading", { name: "Log a case" }).scrollIntoViewIfNeeded();
      await shot(page, "case-new-phone");

      // Hold the upload's answer back a moment so the progress bar can be seen.
      await page.route("**/api/cases/*/photos", async (route) => {
        await new Promise((r) => setTimeout(r, 600));
        await route.continue();
      });
      await page.getByTestId("case-save").click();
      await page.getByTestId("upload-progress").waitFor();
      await page.waitForURL(/\/cases\/(?!new$)[^/]+$/);
      const caseId = new URL(page.url()).pathname.split("/").pop()!;
      expect(caseId).not.toBe("new");

      await page.getByTestId("photo-thumb-0").waitFor();
      await page.getByTestId("photo-thumb-0").click();
      await page.getByTestId("photo-full").waitFor();
      const natural = await page.getByTestId("photo-full").locator("img").first().evaluate(
        (el) =>
          new Promise<number>((resolve) => {
            const img = el as HTMLImageElement;
            if (img.complete && img.naturalWidth) resolve(img.naturalWidth);
            else img.addEventListener("load", () => resolve(img.naturalWidth), { once: true });
          }),
      );
      expect(natural).toBe(24);
      await page.getByTestId("photo-close").click();
      await page.getByTestId("photo-full").waitFor({ state: "hidden" });

      // Two attempts, each in one step.
      await page.getByTestId("remedy-let-stand").click();
      await page.getByTestId("attempt-minutes").fill("15");
      await page.getByTestId("outcome-no-change").click();
      await page.getByTestId("attempt-save").click();
      await page.getByTestId("attempt-1").waitFor();

      await page.getByTestId("remedy-saturated-brine").click();
      await page.getByTestId("attempt-amount").fill("20 mL");
      await page.getByTestId("attempt-minutes").fill("10");
      await page.getByTestId("outcome-cleared").click();
      await page.getByTestId("attempt-note").fill("Band gone after two gentle swirls.");
      await page.getByTestId("attempt-save").click();
      await page.getByTestId("attempt-2").waitFor();
      expect(await page.getByTestId("attempt-2-outcome").innerText()).toMatch(/Cleared/);
      await page.getByTestId("case-what-worked").getByText(/brine/i).waitFor();
      expect(await page.getByTestId("case-layers-caption").innerText()).toBe("Predicted and seen: organic at the bottom");
      const funnel = await page.getByTestId("case-layers").locator("[aria-label^='Funnel drawing']").getAttribute("aria-label");
      expect(funnel).toContain("Bottom layer: organic, 50 mL, 1.327 g/mL");
      await page.getByRole("heading", { name: TITLE }).scrollIntoViewIfNeeded();
      await shot(page, "case-page-phone");
      await page.getByTestId("attempt-1").scrollIntoViewIfNeeded();
      await shot(page, "case-page-phone-attempts");

      // Found again months later: typed as "dichloromethane", searched as "DCM".
      await page.getByTestId("case-back").click();
      await page.getByTestId("cases-search").fill("DCM");
      // The count says "best match first" only once the answer to this search is on screen.
      await page.getByTestId("cases-count").getByText(/^\d+ cases? · best match first$/).waitFor();
      await page.getByTestId(`case-card-${caseId}`).waitFor();
      expect(await page.getByTestId(`case-card-${caseId}`).innerText()).toMatch(/brine/i);
      // Every hit has dichloromethane in its system, whatever name it was logged under.
      const cards = await page.locator('[data-testid^="case-card-"]').allInnerTexts();
      expect(cards.length).toBeGreaterThan(0);
      for (const text of cards) expect(text).toMatch(/Dichloromethane/);
      await shot(page, "cases-list-phone");

      // Filters combine with the search; nothing matching says what to try.
      await page.getByTestId("cases-filters-toggle").click();
      await page.getByTestId("filter-status-abandoned").click();
      await page.getByText("Nothing matches").waitFor();
      await shot(page, "cases-filters-phone");
      await page.getByTestId("filter-status-abandoned").click();
      await page.getByTestId("cases-filters-toggle").click();
      await page.getByTestId(`case-card-${caseId}`).waitFor();

      // The export carries the same search.
      const href = await page.getByTestId("cases-export").getAttribute("href");
      expect(href).toMatch(/\/api\/cases\/export\.csv\?q=DCM$/);
      const csv = await page.evaluate(async (url) => (await fetch(url!, { credentials: "include" })).text(), href);
      expect(csv).toContain(TITLE);

      // Wide: a sortable table with the case beside it.
      await page.setViewportSize(WIDE);
      await page.getByTestId("case-table").waitFor();
      await page.getByTestId(`case-row-${caseId}`).click();
      await page.getByTestId("case-pane").getByText(TITLE).first().waitFor();
      await shot(page, "cases-list-wide");
      await page.getByTestId("sort-title").click();
      await page.getByTestId("sort-title").getByText(/▲/).waitFor();

      await page.goto(`${BASE_URL}/cases/${caseId}`);
      await page.getByTestId("attempt-2").waitFor();
      await shot(page, "case-page-wide");
      await page.goto(`${BASE_URL}/cases/new`);
      await page.getByTestId("organic-0-solvent-search").waitFor();
      await shot(page, "case-new-wide");
    } finally {
      await b.close();
    }
  });
});
