import { expect, expectAccessible, firstLink, mailTo, test, type Page } from "./fixtures";
import { DEMO, DEMO_PASSWORD, storageState, type DemoRole } from "./roles";

const mainNav = (page: Page) => page.locator("header nav[aria-label='Main']").last();

test.describe("demo accounts", () => {
  for (const role of Object.keys(DEMO) as DemoRole[]) {
    test(`the ${role} sees their own navigation`, async ({ browser }) => {
      const context = await browser.newContext({ storageState: storageState(role) });
      const page = await context.newPage();
      await page.setViewportSize({ width: 1366, height: 900 });
      await page.goto("/");
      // The links stand in a row or sit in a few menus by task; open each menu and gather what it holds.
      const nav = mainNav(page);
      const seen = new Set((await nav.getByRole("link").allTextContents()).map((t) => t.trim()));
      const menus = nav.getByRole("button", { expanded: false });
      for (let i = 0; i < (await menus.count()); i++) {
        const menu = nav.locator("button[aria-expanded]").nth(i);
        await menu.click();
        for (const t of await nav.getByRole("link").allTextContents()) seen.add(t.trim());
        await page.keyboard.press("Escape");
        await expect(menu).toHaveAttribute("aria-expanded", "false");
        await expect(menu).toBeFocused();
      }
      for (const label of DEMO[role].nav) expect(seen, label).toContain(label);
      for (const label of DEMO[role].notNav) expect(seen, label).not.toContain(label);
      // Everything fits one row at 1366 px.
      const rows = new Set(await nav.locator(":scope > ul > li").evaluateAll((lis) => lis.map((li) => Math.round(li.getBoundingClientRect().top / 20))));
      expect(rows.size).toBe(1);
      await context.close();
    });
  }
});

test("a visitor signs up, confirms the address from the inbox, signs out, signs back in and sees a gardener's navigation", async ({ page }) => {
  const email = `new-${Date.now()}@example.test`;
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill("Juniper Quell");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill("a sturdy password");
  await page.getByRole("button", { name: "Create my account" }).click();
  // The page says the same for any address; the e-mail carries the link.
  await expect(page.getByText("Check your inbox", { exact: true })).toBeVisible();
  await expectAccessible(page, "sign-up, checking the inbox");
  const mail = await mailTo(page.request, email, "Confirm your e-mail address");
  await page.goto(firstLink(mail));
  await expect(page.getByRole("heading", { name: "Your profile" })).toBeVisible();
  await expect(page.getByText("Welcome to Duffbank")).toBeVisible();
  await expect(page.getByText("Confirm your e-mail address")).toHaveCount(0);
  await expectAccessible(page, "profile after confirming");
  await mainNav(page).getByRole("button", { name: "Build a bed" }).click();
  await expect(mainNav(page).getByRole("link", { name: "My beds" })).toBeVisible();
  await page.keyboard.press("Escape");
  await expect(mainNav(page).getByRole("link", { name: "Council desk" })).toHaveCount(0);

  await mainNav(page).getByRole("button", { name: "Sign out" }).click();
  await expect(mainNav(page).getByRole("link", { name: "Sign in" })).toBeVisible();

  await page.goto("/sign-in");
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill("a sturdy password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(mainNav(page).getByRole("link", { name: /Juniper Quell/ })).toBeVisible();
  await mainNav(page).getByRole("button", { name: "Build a bed" }).click();
  await expect(mainNav(page).getByRole("link", { name: "My beds" })).toBeVisible();
  await page.keyboard.press("Escape");
});

test("a wrong password gives a clear error and no session", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail", { exact: true }).fill(DEMO.gardener.email);
  await page.getByLabel("Password", { exact: true }).fill("not the password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.locator("main [role='alert']")).toContainText("do not match an account");
  await expectAccessible(page, "sign-in with an error");
  await page.goto("/beds");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fbeds/);
});

test("signing in with a link from the local inbox", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail for the link").fill(DEMO.supplier.email);
  await page.getByRole("button", { name: "E-mail me a link" }).click();
  await expect(page.getByText("Check your inbox", { exact: true })).toBeVisible();

  const link = firstLink(await mailTo(page.request, DEMO.supplier.email, "sign-in link"));
  await page.goto(link);
  await mainNav(page).getByRole("button", { name: "Give material" }).click();
  await expect(mainNav(page).getByRole("link", { name: "What I'm giving" })).toBeVisible();
  await expect(mainNav(page).getByRole("link", { name: /Rowan Pike/ })).toBeVisible();
});

test("a gardener opening the council desk gets the 403 page", async ({ browser }) => {
  const context = await browser.newContext({ storageState: storageState("gardener") });
  const page = await context.newPage();
  const res = await page.goto("/council");
  expect(res?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: /not open to your account/ })).toBeVisible();
  await expectAccessible(page, "the 403 page");
  await context.close();
});

test("a signed-out visitor to a signed-in page is sent to sign in", async ({ page }) => {
  await page.goto("/profile");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fprofile/);
});
