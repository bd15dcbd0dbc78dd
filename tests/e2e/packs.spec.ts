// A culture sold by the pack, in Chromium: the grower prices a new listing per pack through
// the form; a gardener counts whole packs on the reserve page (a part of a pack is refused
// beside the field), sees the weight and the price the packs come to, and pays for them; a
// visitor reading in imperial sees the pack in pounds first, its own weight in brackets.
import path from "node:path";
import { expect, test, type Page, expectAccessible } from "./fixtures";
import { metricFiguresOn } from "./axe";
import { payOnCheckoutPage, sql } from "./exchange";
import { storageState } from "./roles";

const shot = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "shots", `${name}.png`);
const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1366, height: 900 };

const TITLE = `Tiger worm starter packs ${Date.now()}`;
let listingId = "";

const price = (page: Page) => page.locator("dt:text-is('Price') + dd");

test.describe.serial("a culture sold by the pack", () => {
  test("the grower prices a new culture per pack through the form", async ({ browser }) => {
    test.setTimeout(90_000);
    const context = await browser.newContext({ storageState: storageState("grower"), viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto("/listings/new");
    await page.getByLabel("Material", { exact: true }).selectOption("worms");
    await page.getByLabel("Title", { exact: true }).fill(TITLE);
    await page.getByLabel("Description", { exact: true }).fill("Eisenia fetida in a handful of their own bedding, a quarter of a kilo to a pack.");
    await page.getByLabel("Counted by").selectOption("kg");
    await page.getByLabel("Quantity (kg)").fill("3");
    // The pack's fields come with the third price choice, and the per-kg price goes away.
    await expect(page.getByLabel("Weight of one pack (kg)")).toHaveCount(0);
    await page.getByLabel("For a price a pack").check();
    await expect(page.getByLabel(/^Price for each/)).toHaveCount(0);
    await page.getByLabel("Weight of one pack (kg)").fill("0.25");
    await page.getByLabel("Price of one pack").fill("9.00");
    await page.getByLabel("Species").fill("Eisenia fetida");
    const map = page.getByRole("region", { name: "Map: click to set the pickup point" });
    await expect(map.locator(".leaflet-container")).toBeVisible();
    await map.locator(".leaflet-container").click({ position: { x: 220, y: 150 } });
    await expect(page.getByRole("combobox", { name: "Pickup point" })).not.toHaveValue("");
    await page.getByLabel("Pickup address").fill("4 Tannery Yard, Fernhollow");

    const priceSection = page.locator("section[aria-labelledby='price-title']");
    await expectAccessible(page, "listing form priced per pack");
    await priceSection.screenshot({ path: shot("packs-form-price") });
    await page.setViewportSize(PHONE);
    await expectAccessible(page, "listing form priced per pack, by phone");
    await priceSection.screenshot({ path: shot("packs-form-price-phone") });
    await page.setViewportSize(DESKTOP);

    await page.getByRole("button", { name: "Publish listing" }).click();
    await expect(page).toHaveURL(/\/listings\/[0-9a-f-]{36}$/);
    listingId = page.url().split("/").pop()!;
    await expect(page.getByRole("heading", { level: 1, name: TITLE })).toBeVisible();
    await expect(price(page)).toHaveText("€9.00 a 0.25 kg pack");
    // Stored in kg: 0.25 kg packs at 900 cents, 3 kg in all.
    const row = sql<{ pack_size: number | string; pack_price_cents: number | string; quantity_total: number | string }>(
      "select pack_size, pack_price_cents, quantity_total from listings where id = ?",
      listingId,
    )[0];
    expect([Number(row.pack_size), Number(row.pack_price_cents), Number(row.quantity_total)]).toEqual([0.25, 900, 3]);
    await expectAccessible(page, "a listing priced per pack");
    await page.screenshot({ path: shot("packs-listing"), fullPage: true });
    await context.close();
  });

  test("a gardener reserves whole packs only, and pays for the packs", async ({ browser }) => {
    test.setTimeout(90_000);
    expect(listingId).not.toBe("");
    const context = await browser.newContext({ storageState: storageState("gardener"), viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto(`/listings/${listingId}/reserve`);
    await expect(page.getByRole("heading", { name: `Reserve: ${TITLE}` })).toBeVisible();
    const packs = page.getByLabel("How many packs");
    await expect(packs).toHaveAccessibleDescription(/12 packs left · each pack is 0\.25 kg/);

    // Two and a half packs: refused beside the field, which takes the focus.
    await packs.fill("2.5");
    await page.getByRole("button", { name: /^Reserve and pay/ }).click();
    const problem = page.locator(`#${await packs.getAttribute("id")}-error`);
    await expect(problem).toHaveText("Give a whole number of packs, 1 or more.");
    await expect(packs).toBeFocused();
    await expect(packs).toHaveAttribute("aria-invalid", "true");
    // No weight is given for part of a pack: it cannot be reserved.
    await expect(page.getByText(/of worms in all/)).toHaveCount(0);
    await expectAccessible(page, "reserve form with part of a pack");
    await page.screenshot({ path: shot("packs-reserve-error"), fullPage: true });

    // Three packs: the weight they make and what they cost; the refusal goes once it is mended.
    await packs.fill("3");
    await expect(page.getByText("That is 0.75 kg of worms in all.")).toBeVisible();
    await expect(problem).toHaveText("");
    const pay = page.getByRole("button", { name: "Reserve and pay €27.00" });
    await expect(pay).toBeVisible();
    await expectAccessible(page, "reserve form with three packs");
    await page.screenshot({ path: shot("packs-reserve"), fullPage: true });
    await page.setViewportSize(PHONE);
    await expectAccessible(page, "reserve form with three packs, by phone");
    await page.screenshot({ path: shot("packs-reserve-phone"), fullPage: true });

    // An emptied field is asked for again as it is typed in, and the count typed back mends it.
    await packs.fill("");
    await expect(problem).toHaveText("Give a whole number of packs, 1 or more.");
    await expect(page.getByText(/of worms in all/)).toHaveCount(0);
    await packs.fill("3");
    await expect(problem).toHaveText("");

    // The server takes kilograms and refuses a part of a pack there too.
    const part = await page.request.post("/api/reservations", { data: { listing_id: listingId, quantity: 0.6 } });
    expect(part.status()).toBe(422);
    expect((await part.json()).error.fields.quantity).toMatch(/whole packs of 0\.25 kg/);

    await pay.click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await payOnCheckoutPage(page, "4242 4242 4242 4242");
    await expect(page.getByRole("heading", { level: 1, name: "Paid" })).toBeVisible({ timeout: 20_000 });
    const held = sql<{ quantity: number | string; amount_cents: number | string }>(
      "select quantity, amount_cents from reservations where listing_id = ? order by created_at desc limit 1",
      listingId,
    )[0];
    // 3 × 0.25 kg and 3 × €9.00.
    expect([Number(held.quantity), Number(held.amount_cents)]).toEqual([0.75, 2700]);
    await context.close();
  });

  test("a visitor reading in imperial sees the pack in pounds, its kilograms only in brackets", async ({ page }) => {
    expect(listingId).not.toBe("");
    await page.setViewportSize(DESKTOP);
    await page.goto("/browse");
    await page.getByRole("banner").getByRole("radio", { name: "Imperial" }).check();
    await expect(page.getByRole("banner").getByRole("radio", { name: "Imperial" })).toBeChecked();
    await page.goto(`/listings/${listingId}`);
    await expect(page.getByRole("banner").getByRole("radio", { name: "Imperial" })).toBeChecked();
    // 0.25 kg is 0.551 lb (1 lb = 0.45359237 kg, by definition).
    await expect(price(page)).toHaveText("€9.00 a 0.55 lb pack (0.25 kg)");
    // Apart from the pack's own weight, in brackets after its pounds, nothing metric.
    expect(await metricFiguresOn(page), "metric units on the imperial listing page").toEqual([]);
    await expectAccessible(page, "a listing priced per pack, in imperial");
    await page.screenshot({ path: shot("packs-listing-imperial"), fullPage: true });
  });
});
