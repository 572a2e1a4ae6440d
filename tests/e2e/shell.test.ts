import { BASE_URL, DEMO, PHONE, WIDE, openBrowser, shot, signIn } from "./browser";

describe("sign-in and the shell", () => {
  it("refuses a wrong password, then signs in, shows tabs on a phone and a rail on a wide screen, and signs out", async () => {
    const b = await openBrowser(PHONE);
    try {
      const { page } = b;
      await signIn(page, DEMO.chemist.email, "not-the-password");
      await page.getByTestId("sign-in-error").waitFor();
      expect(await page.getByTestId("sign-in-error").innerText()).toMatch(/do not match/);
      await shot(page, "sign-in-error-phone");

      await page.getByTestId("sign-in-password").fill(DEMO.chemist.password);
      await page.getByTestId("sign-in-submit").click();
      await page.getByTestId("tab-bar").waitFor();
      // the greeting waits for the session's profile, which can land after the tab bar
      await page.getByText("Hello, Kit").waitFor();
      expect(await page.getByTestId("side-rail").count()).toBe(0);
      // five tabs fit 390 px; the other areas are tiles on Home
      expect(await page.getByTestId("tab-bar").getByRole("link").count()).toBe(5);
      await shot(page, "home-phone");

      await page.reload();
      await page.getByTestId("tab-bar").waitFor();

      await page.getByTestId("home-group").click();
      await page.getByText("Larchmere Process Group · you are chemist").waitFor();
      await page.getByTestId("member-lead@larchmere.example").waitFor();
      await shot(page, "group-phone");

      await page.setViewportSize(WIDE);
      await page.getByTestId("side-rail").waitFor();
      expect(await page.getByTestId("tab-bar").count()).toBe(0);
      await shot(page, "group-wide");

      await page.getByTestId("nav-home").click();
      await page.getByTestId("sign-out").click();
      await page.getByTestId("sign-in-email").waitFor();
      expect(page.url()).toBe(`${BASE_URL}/sign-in`);
    } finally {
      await b.close();
    }
  });
});
