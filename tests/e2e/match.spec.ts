import path from "node:path";
import { expect, test, type Page, expectAccessible } from "./fixtures";
import { seedId } from "../../seeds/ids";
import { storageState } from "./roles";
import { sql } from "./exchange";

const BED = seedId("bed:back-fence");
const shots = process.env.E2E_DIR ? path.join(process.env.E2E_DIR, "shots") : "test-results/shots";
const stops = (page: Page) => page.locator("main [data-stop]");

test.describe("a gardener's saved bed", () => {
  test.use({ storageState: storageState("gardener") });

  test("finds materials: a route on the map and a plan covering every need", async ({ page }) => {
    await page.goto(`/beds/${BED}/materials`);
    await expect(page.getByRole("heading", { name: "Find materials for Back fence bed" })).toBeVisible();
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    // The bed's four layers, all covered by the demo town's listings.
    const needs = page.locator("main section[aria-labelledby='needs-title'] li");
    await expect(needs).toHaveCount(4);
    for (const name of ["Corrugated cardboard", "Fallen leaves", "Straw", "Composting worms"]) await expect(needs.filter({ hasText: name })).toHaveCount(1);
    expect(await stops(page).count()).toBeGreaterThanOrEqual(4);
    await expect(page.getByText(/Still missing/)).toHaveCount(0);
    // Numbered stops and the dashed route line on the map.
    const map = page.getByRole("region", { name: /Map of the route/ });
    await expect(map.locator(".duff-stop-number")).toHaveCount(await stops(page).count());
    await expect(map.locator("path[stroke-dasharray='6 6']")).toHaveCount(1);
    await expect(page.locator("main [data-total='Stops']")).toHaveText(String(await stops(page).count()));
    // The worms come in whole packs from a culture sold by the pack ("Order 2 packs, 1 kg").
    const worms = page.locator("main [data-stop], main [data-parcel]").filter({ hasText: /of composting worms/ });
    await expect(worms).toHaveCount(1);
    const wormListing = (await worms.locator("a[href^='/listings/']").first().getAttribute("href"))!.split("/").pop();
    const pack = sql<{ pack_size: number | null }>("select pack_size from listings where id = ?", wormListing)[0];
    if (pack.pack_size !== null) await expect(worms).toContainText(/(Take|Order) \d+ packs?, [\d.]+ kg of composting worms/);
    else await expect(worms).toContainText(/(Take|Order) [\d.]+ kg of composting worms/);
    // The worms are priced; the free leaves hold a refundable deposit (seeds/listings.ts).
    await expect(page.locator("main [data-total='To pay suppliers']")).toHaveText(/€\d/);
    await expect(page.getByRole("button", { name: /Reserve all \d+ pickups/ })).toBeEnabled();
    await expectAccessible(page, "bed-materials");
    await page.screenshot({ path: path.join(shots, "bed-materials.png"), fullPage: true });
  });

  test("a bed that is not theirs is not found", async ({ page }) => {
    const res = await page.goto(`/beds/${seedId("bed:nobody")}/materials`);
    expect(res?.status()).toBe(404);
    await expect(page.getByRole("heading", { name: /Nothing here/ })).toBeVisible();
  });

  test("reserve all hands the plan to the reservation flow, and goes to the reservations", async ({ page }) => {
    let sent: any = null;
    await page.route("**/api/reservations", async (route) => {
      sent = route.request().postDataJSON();
      await route.fulfill({ status: 201, contentType: "application/json", body: JSON.stringify({ reservations: [] }) });
    });
    await page.goto(`/beds/${BED}/materials`);
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: /Reserve all/ }).click();
    await expect(page).toHaveURL(/\/reservations$/);
    expect(sent.bed_id).toBe(BED);
    expect(sent.items.length).toBeGreaterThanOrEqual(4);
    for (const item of sent.items) {
      expect(typeof item.listing_id).toBe("string");
      expect(item.quantity).toBeGreaterThan(0);
    }
  });

  test("reserve all really holds every pickup, all at once, then goes on to pay", async ({ page }) => {
    await page.goto(`/beds/${BED}/materials`);
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    const planned = await page.locator("main [data-stop]").count();
    await page.getByRole("button", { name: /Reserve all/ }).click();
    // Straw and worms are priced, so the reservation flow sends the gardener to pay.
    await expect(page).not.toHaveURL(/\/materials/, { timeout: 20_000 });
    const mine = await (await page.request.get("/api/reservations")).json();
    // Held until the supplier accepts; auto-accepting listings confirm at once.
    const fresh = mine.reservations.filter((r: any) => r.bed_id === BED && ["held", "confirmed"].includes(r.status));
    expect(fresh.length).toBe(planned);
    // Leave the demo's quantities as they were for the journeys that follow.
    for (const r of fresh) expect((await page.request.post(`/api/reservations/${r.id}/cancel`, { data: {} })).ok()).toBe(true);
  });

  test("a refusal from the reservation flow is shown, not swallowed", async ({ page }) => {
    await page.route("**/api/reservations", (route) =>
      route.fulfill({ status: 409, contentType: "application/json", body: JSON.stringify({ error: { code: "insufficient_quantity", message: "Someone reserved the last of the straw a moment ago." } }) }),
    );
    await page.goto(`/beds/${BED}/materials`);
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: /Reserve all/ }).click();
    await expect(page.locator("main [role='alert']")).toContainText("Someone reserved the last of the straw");
  });
});

test.describe("the public planner", () => {
  test("plans from needs in the link, in either unit system", async ({ page }) => {
    await page.goto("/match?lat=52.205&lng=0.847&radius_km=15&needs=leaves:0.45:m3,cardboard:3.6:m2,straw:0.18:m3");
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    await expect(page.getByText(/Still missing/)).toHaveCount(0);
    // Distances to a tenth of a kilometre, the way a person reads a trip.
    await expect(page.locator("main [data-total='Driving']")).toHaveText(/^\d+(\.\d)? km$/);
    // What the plan costs: paid, and deposits held on the card until pickup.
    await expect(page.locator("main [data-total='To pay suppliers']")).toBeVisible();
    await expect(page.locator("main [data-total='Deposits held']")).toBeVisible();
    await page.getByRole("main").getByRole("radio", { name: "Imperial" }).click();
    await expect(page.locator("main [data-total='Driving']")).toHaveText(/^\d+(\.\d)? mi$/);
    await expect(stops(page).filter({ hasText: "ft³" }).first()).toBeVisible();
    await expectAccessible(page, "match-public");
    await page.screenshot({ path: path.join(shots, "match-public.png"), fullPage: true });
  });

  test("says what is missing and looks further when asked", async ({ page }) => {
    await page.goto("/match?lat=52.205&lng=0.847&radius_km=10&needs=worms:400:kg");
    await expect(page.getByText(/Still missing/)).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: /Look further, up to 20 km/ }).click();
    await expect(page).toHaveURL(/radius_km=20/);
    await expect(page.getByRole("heading", { name: /Not enough within 20 km/ })).toBeVisible({ timeout: 20_000 });
    await expectAccessible(page, "match-unmet");
    await page.screenshot({ path: path.join(shots, "match-unmet.png"), fullPage: true });
  });

  test("offers a substitute for a material nobody has nearby", async ({ page }) => {
    await page.goto("/match?lat=52.205&lng=0.847&radius_km=15&needs=straw:40:m3");
    await expect(page.getByText(/Still missing/)).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: "Use wood chips instead" }).click();
    await expect(page).toHaveURL(/wood_chips/);
    await expect(stops(page).filter({ hasText: /wood chips/i }).first()).toBeVisible({ timeout: 20_000 });
  });

  test("checks the form with the same rules as the server", async ({ page }) => {
    await page.goto("/match");
    await page.getByLabel("Look within (km)").fill("500");
    await page.getByRole("button", { name: "Find materials" }).click();
    await expect(page.locator("#field-radius_km-error")).toHaveText("Choose a distance more than 0 and up to 200 km.");
  });

  test("a visitor who reserves is sent to sign in first", async ({ page }) => {
    await page.route("**/api/reservations", (route) =>
      route.fulfill({ status: 401, contentType: "application/json", body: JSON.stringify({ error: { code: "unauthenticated", message: "Sign in to do this." } }) }),
    );
    await page.goto("/match?lat=52.205&lng=0.847&radius_km=15&needs=cardboard:3.6:m2");
    await expect(stops(page).first()).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: /Reserve all/ }).click();
    await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fmatch/);
  });
});
