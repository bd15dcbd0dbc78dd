// Duffbank's own look, page by page at a laptop's and a phone's width: each changed page has
// no axe violations, every role's navigation fits one row at 1366 px with its menus working
// by keyboard, and a screenshot of each is kept with the run for a person to look at.
import path from "node:path";
import { expect, expectAccessible, test, type Page } from "./fixtures";
import { DEMO, storageState, type DemoRole } from "./roles";

const shot = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "look", `${name}.png`);
const WIDTHS = [
  { name: "laptop", width: 1366, height: 900 },
  { name: "phone", width: 390, height: 844 },
] as const;

// Each page is loaded, drawn and checked twice; a loaded machine needs more than the default minute.
test.describe.configure({ timeout: 180_000 });

async function look(page: Page, url: string, name: string, ready: (page: Page) => Promise<void>) {
  for (const size of WIDTHS) {
    await page.setViewportSize({ width: size.width, height: size.height });
    await page.goto(url);
    await ready(page);
    await page.screenshot({ path: shot(`${name}-${size.name}`), fullPage: true });
    await expectAccessible(page, `${url} at ${size.width} px`);
  }
}

test("home tells a bed's year, with readable layer labels", async ({ page }) => {
  await look(page, "/", "home", async (p) => {
    await expect(p.getByRole("heading", { name: "A bed's first year" })).toBeVisible();
    await expect(p.getByRole("img", { name: /A bed in layers/ })).toBeVisible();
  });
});

test("browse is laid out in material lanes, and the mix tool balances browns and greens", async ({ page }) => {
  await look(page, "/browse", "browse", async (p) => {
    await expect(p.getByRole("navigation", { name: "Materials" }).getByRole("button", { name: /^Leaves/ })).toBeVisible();
    await expect(p.getByTestId("lane-leaves")).toContainText(/on offer/);
    await expect(p.getByTestId("card-material").first()).toBeVisible();
  });
  await look(page, "/mix", "mix", async (p) => {
    await p.getByRole("button", { name: "Work out the mix" }).click();
    await expect(p.getByTestId("balance")).toBeVisible();
    await expect(p.getByTestId("wetness")).toBeVisible();
  });
});

test.describe("for a gardener's bed", () => {
  test.use({ storageState: storageState("gardener") });
  test("browse measures each listing against what the bed still needs", async ({ page }) => {
    await page.goto("/browse");
    await page.getByLabel("For my bed").check();
    await expect(page.getByTestId("fit").first()).toContainText(/covers|does not need|already has/);
    await page.screenshot({ path: shot("browse-for-my-bed"), fullPage: true });
    await expectAccessible(page, "browse for my bed");
  });
});

const LANDING: Record<DemoRole, string> = { gardener: "/reservations", supplier: "/requests", grower: "/grower", council: "/council", moderator: "/moderation" };

for (const role of Object.keys(DEMO) as DemoRole[]) {
  test(`the ${role}'s navigation fits one row, works by keyboard, and their page is accessible`, async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState(role) });
    const page = await context.newPage();
    await look(page, LANDING[role], `nav-${role}`, async (p) => {
      await expect(p.locator("main")).toBeVisible();
    });
    await page.setViewportSize({ width: 1366, height: 900 });
    // One header row: the wordmark, the menus and the unit switch side by side.
    const banner = page.getByRole("banner");
    const middle = async (l: ReturnType<Page["locator"]>) => {
      const b = (await l.boundingBox())!;
      return b.y + b.height / 2;
    };
    const row = await middle(banner.getByRole("link", { name: /Duffbank/ }));
    expect(Math.abs((await middle(banner.getByRole("group", { name: "Units" }).last())) - row)).toBeLessThan(24);
    expect(Math.abs((await middle(banner.locator("nav[aria-label='Main']").last())) - row)).toBeLessThan(24);
    const nav = page.locator("header nav[aria-label='Main']").last();
    const menus = nav.locator("button[aria-expanded]");
    if ((await menus.count()) > 0) {
      const first = menus.first();
      await first.focus();
      await page.keyboard.press("Enter");
      await expect(first).toHaveAttribute("aria-expanded", "true");
      await page.keyboard.press("Tab");
      await expect(nav.locator("button[aria-expanded='true'] + ul a").first()).toBeFocused();
      await page.screenshot({ path: shot(`nav-${role}-open`) });
      await expectAccessible(page, `${role}'s open menu`);
      await page.keyboard.press("Escape");
      await expect(first).toHaveAttribute("aria-expanded", "false");
      await expect(first).toBeFocused();
    }
    await context.close();
  });
}
