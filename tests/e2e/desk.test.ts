import type { Page } from "playwright-core";
import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

/*
 * The lead's desk in the exported app: a reference correction with both values side by side,
 * the audit log and a restore from it, an invitation sent, read from the local outbox and
 * accepted by a new member, and a password reset through the outbox link.
 * Shipped value: dichloromethane 1.3266 g/mL at 20 °C (CRC Handbook).
 */

interface OutboxMessage {
  to: string[];
  subject: string;
  links: string[];
}

async function outboxFor(page: Page, address: string, subjectStart: string): Promise<OutboxMessage> {
  const deadline = Date.now() + 10_000;
  while (Date.now() < deadline) {
    const res = await page.request.get(`${BASE_URL}/api/dev/outbox`);
    const { messages } = (await res.json()) as { messages: OutboxMessage[] };
    const found = messages.find((m) => m.to.includes(address) && m.subject.startsWith(subjectStart));
    if (found) return found;
    await page.waitForTimeout(200);
  }
  throw new Error(`No "${subjectStart}" mail to ${address} in the outbox.`);
}

async function openDesk(page: Page, section: string) {
  await page.goto(`${BASE_URL}/desk/${section}`);
  await page.getByTestId(`desk-tab-${section}`).waitFor();
}

describe("the lead's desk", () => {
  it("adds a reference correction with source and reason, shows shipped and group values, and restores from the audit log", async () => {
    const b = await openBrowser(WIDE);
    try {
      const { page } = b;
      await signIn(page, DEMO.lead.email, DEMO.lead.password);
      await page.getByTestId("side-rail").waitFor();
      await page.getByTestId("nav-desk").click();
      await page.getByTestId("desk-tab-people").waitFor();
      await page.getByTestId("desk-tab-reference").click();

      await page.getByTestId("correction-solvent-search").fill("methylene chloride");
      await page.getByTestId("correction-solvent-option-dichloromethane").click();
      await page.getByTestId("current-values").waitFor();
      expect(await page.getByTestId("current-values").innerText()).toContain("Shipped: 1.327 g/mL");
      await page.getByTestId("correction-value").fill("1.318");
      // Saving without a source or reason is refused with the field named.
      await page.getByTestId("correction-save").click();
      await page.getByText("Name the source: an SDS, a handbook table, a measurement in the lab.").waitFor();
      await page.getByTestId("correction-source").fill("Supplier SDS, lot 4471, section 9");
      await page.getByTestId("correction-reason").fill("Our stabilised grade reads lighter than the handbook value.");
      await page.getByTestId("correction-save").click();
      await page.getByTestId("correction-saved").waitFor();
      expect(await page.getByTestId("correction-saved").innerText()).toMatch(/Dichloromethane, density at 20 °c = 1\.318 g\/mL for the group \(shipped 1\.327 g\/mL\)/i);

      const row = page.getByTestId("corrections-row").first();
      await row.waitFor();
      const rowText = await row.innerText();
      expect(rowText).toContain("Dichloromethane");
      expect(rowText).toContain("1.327 g/mL"); // shipped, CRC 1.3266
      expect(rowText).toContain("1.318 g/mL"); // the group's
      expect(rowText).toContain("Supplier SDS, lot 4471, section 9");
      expect(rowText).toContain("Our stabilised grade reads lighter");
      await shot(page, "desk-reference-wide");

      // The group's computations use it: the solvent detail the Solvents screen reads.
      const detail = (await (await page.request.get(`${BASE_URL}/api/solvents/dichloromethane`)).json()) as { densityGPerMl20C: { value: number } };
      expect(detail.densityGPerMl20C.value).toBe(1.318);

      await page.getByTestId("desk-tab-audit").click();
      const entry = page.getByTestId("audit-row").first();
      await entry.waitFor();
      expect(await entry.innerText()).toContain("Corrected a reference value");
      expect(await entry.innerText()).toContain("payload.value");
      await shot(page, "desk-audit-wide");
      await entry.getByText("Undo (back to before it existed)").click();
      await page.getByText("Restored; the log shows the restore as a new entry.").waitFor();
      const after = (await (await page.request.get(`${BASE_URL}/api/solvents/dichloromethane`)).json()) as { densityGPerMl20C: { value: number } };
      expect(after.densityGPerMl20C.value).toBe(1.3266);
      await page.getByTestId("desk-tab-reference").click();
      await page.getByText("The shipped tables apply").waitFor();
    } finally {
      await b.close();
    }
  });

  it("invites by e-mail; the invitee follows the mailed link, signs up, joins, and can reset the password by mail", async () => {
    const lead = await openBrowser(PHONE);
    const invitee = await openBrowser(PHONE);
    const address = `new-chemist-${Date.now()}@larchmere.example`;
    try {
      await signIn(lead.page, DEMO.lead.email, DEMO.lead.password);
      await lead.page.getByTestId("tab-bar").waitFor();
      await openDesk(lead.page, "people");
      await lead.page.getByTestId("invite-email").fill(address);
      await lead.page.getByTestId("invite-role-chemist").click();
      await lead.page.getByTestId("invite-send").click();
      await lead.page.getByTestId("invite-result").waitFor();
      await lead.page.getByTestId(`pending-${address}`).waitFor();
      await lead.page.getByTestId(`pending-${address}`).scrollIntoViewIfNeeded();
      await shot(lead.page, "desk-people-phone");

      const mail = await outboxFor(lead.page, address, "You are invited");
      const link = mail.links.find((l) => l.includes("/invite/"))!;
      expect(link.startsWith(`${BASE_URL}/invite/`)).toBe(true);

      const { page } = invitee;
      await page.goto(link);
      await page.getByTestId("invite-summary").waitFor();
      expect(await page.getByTestId("invite-summary").innerText()).toContain(`invites ${address} to join Larchmere Process Group as a chemist`);
      await page.getByTestId("invite-name").fill("Larchmere newcomer");
      await page.getByTestId("invite-password").fill("first-pass-phrase-1");
      await shot(page, "invite-phone");
      await page.getByTestId("invite-account-submit").click();
      await page.getByTestId("tab-bar").waitFor();
      const me = (await (await page.request.get(`${BASE_URL}/api/me`)).json()) as { groups: { name: string; role: string }[] };
      expect(me.groups).toEqual([expect.objectContaining({ name: "Larchmere Process Group", role: "chemist" })]);

      // The new chemist sees the desk read-only.
      await openDesk(page, "people");
      await page.getByTestId("desk-read-only").waitFor();
      expect(await page.getByTestId("invite-send").count()).toBe(0);
      await shot(page, "desk-chemist-phone");

      // The lead's pending list no longer holds the accepted invitation.
      await lead.page.reload();
      await lead.page.getByTestId("invite-email").waitFor();
      expect(await lead.page.getByTestId(`pending-${address}`).count()).toBe(0);

      // Password reset through the mailed link.
      await page.context().clearCookies();
      await page.goto(`${BASE_URL}/sign-in`);
      await page.getByTestId("forgot-password-link").click();
      await page.getByTestId("forgot-email").fill(address);
      await page.getByTestId("forgot-submit").click();
      await page.getByTestId("forgot-sent").waitFor();
      const reset = await outboxFor(page, address, "Reset your Phasewise password");
      await page.goto(reset.links.find((l) => l.includes("/reset-password"))!);
      await page.getByTestId("reset-password").fill("second-pass-phrase-2");
      await page.getByTestId("reset-password-again").fill("second-pass-phrase-2");
      await page.getByTestId("reset-submit").click();
      await page.getByTestId("reset-done").waitFor();
      await signIn(page, address, "second-pass-phrase-2");
      await page.getByTestId("tab-bar").waitFor();
    } finally {
      await lead.close();
      await invitee.close();
    }
  });
});
