// The journeys of issue 14 as whole paths: a visitor reading in imperial everywhere, the unit
// switch and the phone menu by keyboard, the page each role lands on, a return from checkout
// on the server's other host name, reserving a plan with a posted culture in it, the listing
// form's focus on a failed submit, and the planner handing its plan to matching in one go.
// Every page on the way is checked with axe.
import path from "node:path";
import { expect, test, type Page } from "./fixtures";
import { expectNoAxeViolations, metricFiguresOn } from "./axe";
import { payOnCheckoutPage, run, sql } from "./exchange";
import { DEMO, DEMO_PASSWORD, storageState, type DemoRole } from "./roles";
import { seedId } from "../../seeds/ids";

const shots = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "shots", `${name}.png`);
const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1366, height: 900 };

async function switchUnits(page: Page, to: "Metric" | "Imperial") {
  await page.getByRole("banner").getByRole("radio", { name: to }).check();
  await expect(page.getByRole("banner").getByRole("radio", { name: to })).toBeChecked();
}

test.describe("a visitor reading in imperial", () => {
  test("sees no metric unit on home, browse, a listing, the planner, match and a giveaway day", async ({ page }) => {
    test.setTimeout(120_000);
    await page.setViewportSize(DESKTOP);
    await page.goto("/browse");
    await switchUnits(page, "Imperial");
    const listing = sql<{ id: string }>("select id from listings where status = 'active' and material_code = 'wood_chips' and unit = 'm3' order by title limit 1")[0];
    const pages: [string, string, (p: Page) => Promise<void>][] = [
      ["home", "/", async (p) => void (await expect(p.getByTestId("kept-kg")).toBeVisible())],
      ["browse", "/browse", async (p) => void (await expect(p.locator("main article").first()).toBeVisible())],
      ["listing", `/listings/${listing.id}`, async (p) => void (await expect(p.getByRole("heading", { level: 1 })).toBeVisible())],
      ["planner", "/plan", async (p) => void (await expect(p.getByLabel("Length (ft)")).toBeVisible())],
      ["match", "/match?lat=52.205&lng=0.847&radius_km=15&needs=leaves:0.45:m3,cardboard:3.6:m2,straw:0.18:m3", async (p) => void (await expect(p.locator("main [data-stop]").first()).toBeVisible({ timeout: 20_000 }))],
      ["giveaway", `/giveaways/${seedId("giveaway:january-chips")}`, async (p) => void (await expect(p.getByRole("heading", { level: 1 })).toBeVisible())],
      ["giveaways", "/giveaways", async (p) => void (await expect(p.getByRole("heading", { level: 1 })).toBeVisible())],
    ];
    for (const [name, url, ready] of pages) {
      await page.goto(url);
      await ready(page);
      await expect(page.getByRole("banner").getByRole("radio", { name: "Imperial" })).toBeChecked();
      expect(await metricFiguresOn(page), `metric units on ${name}`).toEqual([]);
      await expectNoAxeViolations(page, name);
      await page.screenshot({ path: shots(`imperial-${name}`), fullPage: true });
    }
    // The planner's own figures came in feet and gallons.
    await page.goto("/plan");
    await page.getByRole("button", { name: "Work out what it takes" }).click();
    await expect(page.locator("dt:has-text('Water for the first soak') ~ dd").first()).toHaveText(/US gal$/);
    expect(await metricFiguresOn(page), "metric units on the planner's estimate").toEqual([]);
    // And back: the choice is the visitor's, kept for the next visit.
    await switchUnits(page, "Metric");
    await page.goto("/browse");
    await expect(page.getByRole("banner").getByRole("radio", { name: "Metric" })).toBeChecked();
  });

  test("the unit switch is a radio group the arrow keys move through", async ({ page }) => {
    await page.setViewportSize(DESKTOP);
    await page.goto("/browse");
    const banner = page.getByRole("banner");
    await banner.getByRole("radio", { name: "Metric" }).focus();
    await page.keyboard.press("ArrowRight");
    await expect(banner.getByRole("radio", { name: "Imperial" })).toBeChecked();
    await expect(banner.getByRole("radio", { name: "Imperial" })).toBeFocused();
    await expect(page.locator("main")).toContainText(/ mi\b/);
    await page.keyboard.press("ArrowLeft");
    await expect(banner.getByRole("radio", { name: "Metric" })).toBeChecked();
  });
});

test.describe("on a phone", () => {
  test("the menu opens from its button, closes on Escape and gives the focus back", async ({ page }) => {
    await page.setViewportSize(PHONE);
    await page.goto("/");
    const button = page.getByRole("button", { name: "Menu" });
    await button.focus();
    await page.keyboard.press("Enter");
    await expect(button).toHaveAttribute("aria-expanded", "true");
    const browse = page.getByRole("banner").getByRole("link", { name: "Browse" });
    await expect(browse).toBeVisible();
    await expectNoAxeViolations(page, "open phone menu");
    await page.screenshot({ path: shots("phone-menu") });
    await page.keyboard.press("Escape");
    await expect(browse).toBeHidden();
    await expect(button).toBeFocused();
    await expect(button).toHaveAttribute("aria-expanded", "false");
    // A followed link closes it too.
    await button.click();
    await browse.click();
    await expect(page).toHaveURL(/\/browse/);
    await expect(page.getByRole("banner").getByRole("link", { name: "Browse" })).toBeHidden();
  });
});

test.describe("on a phone, signed in", () => {
  test("the council desk's days and 'What I'm giving' fit at 390 px as cards", async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState("council"), viewport: PHONE });
    const page = await context.newPage();
    for (const [name, url] of [["council-desk", "/council"], ["giving", "/listings/mine"]] as const) {
      await page.goto(url);
      await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
      // Nothing wider than the screen: no sideways scrolling.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
      await expectNoAxeViolations(page, name);
      await page.screenshot({ path: shots(`phone-${name}`), fullPage: true });
    }
    await expect(page.locator("td[data-label='Status']").first()).toBeVisible();
    await context.close();
  });

  test("a listing's reserve action stays in reach at the foot of the screen", async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState("gardener"), viewport: PHONE });
    const page = await context.newPage();
    const listing = sql<{ id: string }>("select id from listings where status = 'active' and material_code = 'straw' order by title limit 1")[0];
    await page.goto(`/listings/${listing.id}`);
    const reserve = page.getByRole("link", { name: "Reserve", exact: true });
    await expect(reserve).toBeInViewport();
    await page.mouse.wheel(0, 2000);
    await expect(reserve).toBeInViewport();
    await expectNoAxeViolations(page, "listing on a phone");
    await page.screenshot({ path: shots("phone-listing-reserve") });
    await context.close();
  });
});

test.describe("each role's landing page", () => {
  const WAITING: Record<DemoRole, string[]> = {
    gardener: ["To pay or put a deposit on", "Pickups to make", "Waiting for a supplier's answer"],
    supplier: ["Requests to answer", "Pickups today"],
    grower: ["Requests to answer", "Orders to pack or post"],
    council: ["Requests to answer", "Coming giveaway days"],
    moderator: ["Reports to handle", "Roles to decide on"],
  };
  for (const role of Object.keys(DEMO) as DemoRole[]) {
    for (const viewport of [DESKTOP, PHONE]) {
      test(`a ${role} lands on what is waiting for them after signing in (${viewport.width} px)`, async ({ browser }) => {
        // Signing in, axe over the page and a full-page shot: give a loaded machine room.
        test.setTimeout(120_000);
        const context = await browser.newContext({ viewport });
        const page = await context.newPage();
        await page.goto("/sign-in");
        await page.getByLabel("E-mail", { exact: true }).fill(DEMO[role].email);
        await page.getByLabel("Password", { exact: true }).fill(DEMO_PASSWORD);
        await page.getByRole("button", { name: "Sign in" }).click();
        await expect(page).toHaveURL(/\/home$/);
        await expect(page.getByRole("heading", { level: 1, name: /^Hello, / })).toBeVisible();
        for (const title of WAITING[role]) await expect(page.getByRole("heading", { level: 2, name: new RegExp(`^${title.replace(/'/g, ".")} \\(\\d+\\)$`) })).toBeVisible();
        await expectNoAxeViolations(page, `${role} home`);
        await page.screenshot({ path: shots(`home-${role}-${viewport.width}`), fullPage: true });
        await context.close();
      });
    }
  }
});

test.describe("a gardener", () => {
  test.use({ storageState: storageState("gardener") });

  test("returning from the checkout page on the server's other host name is still signed in, on 'Deposit held'", async ({ page, baseURL }) => {
    test.setTimeout(90_000);
    const other = baseURL!.replace("127.0.0.1", "localhost");
    const leaves = sql<{ id: string; title: string }>(
      `select l.id, l.title from listings l join users u on u.id = l.owner_id where u.email = 'supplier@duffbank.test'
       and l.status = 'active' and l.deposit_cents > 0 and l.price_cents = 0 order by l.quantity_total - l.quantity_held desc limit 1`,
    )[0];
    // A page asked for on the other name is sent to the canonical one first, where the session cookie lives.
    await page.goto(`${other}/listings/${leaves.id}/reserve`);
    await expect(page).toHaveURL(`${baseURL}/listings/${leaves.id}/reserve`);
    await expect(page.getByRole("heading", { name: `Reserve: ${leaves.title}` })).toBeVisible();
    await page.getByLabel("How many bags").fill("1");
    await page.getByRole("button", { name: /^Reserve and place the .* deposit/ }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await payOnCheckoutPage(page, "4242 4242 4242 4242");
    await page.waitForURL(/\/reservations\/paid\?session_id=cs_test_/);
    await expect(page.getByRole("heading", { level: 1, name: "Deposit held" })).toBeVisible({ timeout: 20_000 });
    // The same return, arriving on the other name (as a checkout page set up with it would send it).
    await page.goto(page.url().replace(baseURL!, other));
    await expect(page).toHaveURL(new RegExp(`^${baseURL!.replace(/[.]/g, "\\.")}/reservations/paid\\?session_id=cs_test_`));
    await expect(page.getByRole("heading", { level: 1, name: "Deposit held" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Main" }).first().getByRole("button", { name: "Sign out" })).toBeVisible();
    await expectNoAxeViolations(page, "deposit held");
    await page.screenshot({ path: shots("return-deposit-held"), fullPage: true });
  });

  test("reserving a plan with a posted culture shows the culture's own problem beside it, and offers the rest", async ({ page }) => {
    test.setTimeout(90_000);
    // For this journey the grower's cultures come by post only.
    const cultures = sql<{ id: string; quality: string }>("select l.id, l.quality from listings l join users u on u.id = l.owner_id where u.email = 'grower@duffbank.test' and l.material_code = 'worms'");
    try {
      for (const c of cultures) run("update listings set quality = ? where id = ?", JSON.stringify({ ...JSON.parse(c.quality || "{}"), ships: true, pickup: false }), c.id);
      await page.goto("/match?lat=52.205&lng=0.847&radius_km=15&needs=leaves:0.45:m3,worms:0.5:kg");
      const parcel = page.locator("main [data-parcel]").first();
      await expect(parcel).toBeVisible({ timeout: 20_000 });
      await expect(parcel).toContainText("not a stop on your route");
      // Half a kilo is one pack of a culture sold in 0.5 kg packs, or 0.5 kg of one sold by the kg.
      const picked = (await parcel.locator("a[href^='/listings/']").first().getAttribute("href"))!.split("/").pop();
      const packed = sql<{ pack_size: number | null }>("select pack_size from listings where id = ?", picked)[0];
      await expect(parcel).toContainText(packed.pack_size === null ? "Order 0.5 kg of composting worms" : "Order 1 pack, 0.5 kg of composting worms");
      // The parcel is no numbered stop, and each stop links to its listing.
      await expect(page.locator("main [data-stop]")).toHaveCount(1);
      await expect(page.locator("main [data-stop] a[href^='/listings/']")).toHaveCount(1);
      await page.getByRole("button", { name: /^Reserve all 2 pickups/ }).click();
      // The API's message for the culture, beside the culture; the summary takes the focus.
      const problem = parcel.locator("[id$='-error']");
      await expect(problem).toContainText(/address/i);
      await expect(page.locator("[data-error-summary]")).toBeFocused();
      await expect(page.getByRole("button", { name: "Reserve the other 1 only" })).toBeVisible();
      await expectNoAxeViolations(page, "reserve all with a problem");
      await page.screenshot({ path: shots("reserve-all-parcel-problem"), fullPage: true });
    } finally {
      for (const c of cultures) run("update listings set quality = ? where id = ?", c.quality, c.id);
    }
  });

  test("the planner's 'Find these materials nearby' opens a worked-out plan, with no extra click", async ({ page }) => {
    await page.goto("/plan");
    await expect(page.getByLabel("Length (m)")).toHaveValue("3");
    await page.getByRole("combobox", { name: "Where the bed is" }).fill("Orchard");
    await page.getByRole("option").first().click();
    await page.getByRole("button", { name: "Work out what it takes" }).click();
    await page.getByRole("link", { name: "Find these materials nearby" }).click();
    await expect(page).toHaveURL(/\/match\?/);
    await expect(page.locator("main [data-stop]").first()).toBeVisible({ timeout: 20_000 });
    await expectNoAxeViolations(page, "match from the planner");
  });

  test("the reserve form can be used with the keyboard alone, and says the tighter limit", async ({ page }) => {
    const straw = sql<{ id: string; title: string }>(
      "select id, title from listings where material_code = 'straw' and status = 'active' and price_cents > 0 and max_per_reservation is not null order by quantity_total - quantity_held desc limit 1",
    )[0];
    await page.goto(`/listings/${straw.id}/reserve`);
    const qty = page.getByLabel("How many bales");
    await qty.focus();
    await page.keyboard.press("Control+A");
    await page.keyboard.type("999");
    await page.keyboard.press("Enter");
    await expect(qty).toBeFocused();
    await expect(page.locator(`#${await qty.getAttribute("id")}-error`)).toHaveText(/^(At most \d+ bales per reservation on this listing|Only \d+ bales left)\.$/);
    await expectNoAxeViolations(page, "reserve form with an error");
  });
});

test.describe("a supplier's listing form", () => {
  test.use({ storageState: storageState("supplier") });

  test("a failed submit moves the focus to a summary linked to each field, the map point among them", async ({ page }) => {
    await page.goto("/listings/new");
    await page.getByLabel("Title", { exact: true }).fill("Leaves from the front lawn");
    await page.getByRole("button", { name: "Publish listing" }).click();
    const summary = page.locator("[data-error-summary]");
    await expect(summary).toBeFocused();
    const toPoint = summary.getByRole("link", { name: /pickup point/i });
    await expect(toPoint).toBeVisible();
    await toPoint.click();
    await expect(page.getByRole("combobox", { name: "Pickup point" })).toBeFocused();
    await expectNoAxeViolations(page, "listing form with errors");
    await page.screenshot({ path: shots("listing-form-errors"), fullPage: true });
  });
});

/** Presses Tab (or Shift+Tab) until `target` has the focus, as a keyboard user would; fails after `max` presses. */
async function tabTo(page: Page, target: ReturnType<Page["locator"]>, { back = false, max = 25 } = {}) {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(back ? "Shift+Tab" : "Tab");
  }
  throw new Error(`the focus did not reach the target within ${max} presses`);
}

test.describe("the planner with the keyboard alone", () => {
  test("finds the place by name, draws the outline at the cross with the arrow keys, and works the bed out", async ({ page }) => {
    await page.goto("/plan");
    const form = page.getByRole("form", { name: "Bed planner" });
    // The one click-free start: the focus on the first choice of the form, then only keys.
    // The form is disabled until the page has hydrated (components/ui/form.tsx), and a
    // disabled radio takes no focus, so wait for it first.
    const first = form.getByRole("radio", { name: "Length × width" });
    await expect(first).toBeEnabled();
    await first.focus();
    await page.keyboard.press("ArrowRight");
    await expect(form.getByRole("radio", { name: "Draw it on the map" })).toBeChecked();

    const place = form.getByRole("combobox", { name: "Where the bed is" });
    await tabTo(page, place);
    await page.keyboard.type("Orchard");
    await expect(page.getByRole("option").first()).toBeVisible();
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Enter");
    await expect(place).toHaveValue(/Orchard/);

    const map = form.locator(".leaflet-container");
    const corner = form.getByRole("button", { name: "Add a corner at the cross" });
    // Four corners of a square, one arrow-key pan apart.
    for (const key of ["ArrowRight", "ArrowDown", "ArrowLeft", null]) {
      await tabTo(page, corner);
      await page.keyboard.press("Enter");
      if (!key) break;
      await tabTo(page, map, { back: true });
      const before = await map.evaluate((el) => el.querySelector(".leaflet-map-pane")?.getAttribute("style"));
      await page.keyboard.press(key);
      // The pan is animated: wait until the map has moved before the next corner.
      await expect.poll(() => map.evaluate((el) => el.querySelector(".leaflet-map-pane")?.getAttribute("style"))).not.toBe(before);
      await page.waitForTimeout(400);
    }
    await expect(form.getByText("4 corners placed.")).toBeVisible();

    await tabTo(page, form.getByRole("button", { name: "Work out what it takes" }));
    await page.keyboard.press("Enter");
    await expect(page.getByRole("link", { name: "Find these materials nearby" })).toBeVisible({ timeout: 20_000 });
    await expectNoAxeViolations(page, "planner worked out by keyboard");
  });
});
