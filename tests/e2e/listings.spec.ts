import path from "node:path";
import sharp from "sharp";
import { expect, test, type Page, expectAccessible } from "./fixtures";
import { storageState } from "./roles";
import { sql } from "./exchange";

// The supply side in a real browser: a supplier posts leaves with two photos (upload
// progress visible, straight to the local Cloudinary fake), a visitor finds them by
// material and distance, on the map, and opens them; no public page or response carries
// the exact pickup point or address.

const stamp = Date.now();
const TITLE = `Copper beech leaves ${stamp}`;
const ADDRESS = `${(stamp % 80) + 10} Juniper Steps, Fernhollow`;
let listingId = "";

const shots = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "screens", `${name}.png`);

/** Photos big enough (noise compresses badly) that a throttled upload shows its progress. */
async function photo(seed: number): Promise<Buffer> {
  return sharp({ create: { width: 900, height: 675, channels: 3, background: "#000", noise: { type: "gaussian", mean: 110 + seed * 20, sigma: 45 } } })
    .jpeg({ quality: 92 })
    .withExif({ IFD0: { Make: "DuffbankTestCam" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "52/1 12/1 18/1", GPSLongitudeRef: "E", GPSLongitude: "0/1 50/1 49/1" } })
    .toBuffer();
}

async function mapReady(page: Page, name: string) {
  const map = page.getByRole("region", { name });
  await expect(map.locator(".leaflet-container")).toBeVisible();
  return map;
}

test.describe.serial("listings", () => {
  test("a supplier posts a listing with two photos and it appears in browse", async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState("supplier") });
    const page = await context.newPage();
    await page.goto("/listings/new");
    await expect(page.getByRole("heading", { name: "Post a listing" })).toBeVisible();

    await page.getByLabel("Material", { exact: true }).selectOption("leaves");
    await page.getByLabel("Title", { exact: true }).fill(TITLE);
    await page.getByLabel("Description", { exact: true }).fill("Raked from the lawn under one big tree. Dry, in paper sacks by the side gate.");
    await page.getByLabel("Quantity (bags)").fill("9");
    await page.getByLabel("Raked from gardens or a lawn").check();
    await expect(page.getByText(/Leaves vacuumed up from the kerb or roadside/)).toBeVisible();

    const map = await mapReady(page, "Map: click to set the pickup point");
    await map.locator(".leaflet-container").click({ position: { x: 200, y: 140 } });
    // The point is said back in words (the nearest street or place), never as coordinates.
    await expect(page.getByRole("combobox", { name: "Pickup point" })).not.toHaveValue("");
    await expect(page.getByRole("combobox", { name: "Pickup point" })).not.toHaveValue(/\d+\.\d{3,}/);
    await page.getByLabel("Pickup address").fill(ADDRESS);

    // Slow the upload link down so the progress bars have something to show.
    const cdp = await context.newCDPSession(page);
    await cdp.send("Network.enable");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 256 * 1024 });
    await page.locator("input[type=file]").setInputFiles([
      { name: "leaf-pile.jpg", mimeType: "image/jpeg", buffer: await photo(1) },
      { name: "side-gate.jpg", mimeType: "image/jpeg", buffer: await photo(2) },
    ]);
    await expect(page.getByRole("progressbar", { name: "Upload of leaf-pile.jpg" })).toBeVisible();
    await expect(page.getByText(/Uploading… \d+ %/).first()).toBeVisible();
    await page.screenshot({ path: shots("form-uploading"), fullPage: true });
    await expect(page.getByText("Uploaded · cover photo")).toBeVisible({ timeout: 30_000 });
    await expect(page.getByText(/^Uploaded/)).toHaveCount(2, { timeout: 30_000 });
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await expect(page.getByRole("progressbar")).toHaveCount(2);
    // The second photo becomes the cover.
    await page.getByRole("button", { name: "Move photo 2 earlier" }).click();
    await expectAccessible(page, "form");
    await page.screenshot({ path: shots("form"), fullPage: true });

    await page.getByRole("button", { name: "Publish listing" }).click();
    await expect(page).toHaveURL(/\/listings\/[0-9a-f-]{36}$/);
    listingId = page.url().split("/").pop()!;
    await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
    await expect(page.getByRole("img", { name: `Photo 1 of 2: ${TITLE}` })).toBeVisible();
    await expect(page.getByText("Only you see this")).toBeVisible();
    await expect(page.getByText(ADDRESS)).toBeVisible();

    // The delivered photos are clean: no GPS position, no camera name.
    const src = await page.getByRole("img", { name: `Photo 1 of 2: ${TITLE}` }).getAttribute("src");
    expect(src).toContain("/duffbank-local/image/upload/");
    const delivered = Buffer.from(await (await page.request.get(src!)).body());
    expect((await sharp(delivered).metadata()).exif).toBeUndefined();
    expect(delivered.includes(Buffer.from("DuffbankTestCam"))).toBe(false);

    await page.goto(`/browse?q=${encodeURIComponent(String(stamp))}`);
    await expect(page.getByRole("link", { name: TITLE })).toBeVisible();
    await context.close();
  });

  test("a visitor filters by material and distance, sees it on the map and opens it", async ({ page }) => {
    await page.goto("/browse");
    await expect(page.getByRole("heading", { name: "Find material" })).toBeVisible();
    const lanes = page.getByRole("navigation", { name: "Materials" });
    await lanes.getByRole("button", { name: /^Leaves/ }).click();
    await expect(lanes.getByRole("button", { name: /^Leaves/ })).toHaveAttribute("aria-pressed", "true");
    await page.getByLabel("How far", { exact: true }).selectOption("5");
    await expect(page).toHaveURL(/material=leaves/);
    await expect(page).toHaveURL(/radius_km=5/);
    await expect(page.getByText("nearest first", { exact: true })).toBeVisible();
    const card = page.locator(`#listing-${listingId}`);
    await expect(card).toBeVisible();
    await expect(card).toContainText(/about [\d.]+ (m|km) away/);
    // Every card is leaves now.
    const kinds = await page.getByTestId("card-material").allTextContents();
    expect(kinds.length).toBeGreaterThan(0);
    expect(new Set(kinds)).toEqual(new Set(["Fallen leaves"]));

    await mapReady(page, "Map of the listings shown; points are approximate");
    const marker = page.locator(`.listing-marker-${listingId}`);
    await expect(marker).toHaveCount(1);
    await expectAccessible(page, "browse");
    await page.screenshot({ path: shots("browse"), fullPage: true });
    // The pointer rests off the list, as a user's does on the map: choosing a marker scrolls
    // its card into view, and a card sliding under a resting pointer would choose that card.
    await page.mouse.move(1, 1);
    await marker.dispatchEvent("click");
    const panel = page.getByRole("link", { name: "Open this listing" });
    await expect(panel).toHaveAttribute("href", `/listings/${listingId}`);
    await panel.click();
    await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
    await expect(page.getByRole("link", { name: "Sign in to reserve" })).toBeVisible();
    await expect(page.getByRole("link", { name: "Reserve", exact: true })).toHaveCount(0);
    await expect(page.locator("[data-caution='roadside']")).toBeVisible();
    await expectAccessible(page, "detail");
    await page.screenshot({ path: shots("detail"), fullPage: true });
  });

  test("a gardener gets the Reserve link; the supplier pauses and resumes from the dashboard", async ({ browser }) => {
    const gardener = await browser.newContext({ storageState: storageState("gardener") });
    const g = await gardener.newPage();
    await g.goto(`/listings/${listingId}`);
    await expect(g.getByRole("link", { name: "Reserve", exact: true })).toHaveAttribute("href", `/listings/${listingId}/reserve`);
    await gardener.close();

    const supplier = await browser.newContext({ storageState: storageState("supplier") });
    const s = await supplier.newPage();
    await s.goto("/listings/mine");
    const row = s.locator(`tr[data-listing-id='${listingId}']`);
    await expect(row).toContainText("On offer");
    await expect(row).toContainText("9 bags");
    await s.getByLabel("Filter").fill(String(stamp));
    await expect(s.locator("tbody tr")).toHaveCount(1);
    await row.getByRole("button", { name: `Pause “${TITLE}”` }).click();
    await expect(row).toContainText("Paused");
    await expectAccessible(s, "mine");
    await s.screenshot({ path: shots("mine"), fullPage: true });
    const api = await s.request.get(`/api/listings?q=${stamp}`);
    expect((await api.json()).items).toHaveLength(0);
    await row.getByRole("button", { name: `Resume “${TITLE}”` }).click();
    await expect(row).toContainText("On offer");

    // Edit: more bags, and the photos swapped back (saved at once in edit mode).
    await row.getByRole("link", { name: `Edit “${TITLE}”` }).click();
    await expect(s.getByRole("heading", { name: `Edit “${TITLE}”` })).toBeVisible();
    await expect(s.getByLabel("Quantity (bags)")).toHaveValue("9");
    const before = await s.getByRole("img", { name: "Photo 1" }).getAttribute("src");
    await s.getByRole("button", { name: "Move photo 2 earlier" }).click();
    await expect(s.getByRole("img", { name: "Photo 1" })).not.toHaveAttribute("src", before!);
    await s.getByLabel("Quantity (bags)").fill("12");
    await expectAccessible(s, "edit");
    await s.screenshot({ path: shots("edit"), fullPage: true });
    await s.getByRole("button", { name: "Save changes" }).click();
    await expect(s).toHaveURL(new RegExp(`/listings/${listingId}$`));
    await expect(s.getByRole("definition").first()).toContainText("12 bags");
    await supplier.close();

    // Someone else's listing is not there to edit.
    const grower = await browser.newContext({ storageState: storageState("grower") });
    const res = await (await grower.newPage()).goto(`/listings/${listingId}/edit`);
    expect(res?.status()).toBe(404);
    await grower.close();
  });

  test("browse works on a phone-sized screen", async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto("/browse?material=straw");
    await expect(page.getByRole("heading", { name: "Find material" })).toBeVisible();
    await mapReady(page, "Map of the listings shown; points are approximate");
    await expect(page.locator("article").first()).toBeVisible();
    await expectAccessible(page, "browse-phone");
    await page.screenshot({ path: shots("browse-phone"), fullPage: true });
    await page.locator("article h3 a").first().click();
    await expect(page.locator("[data-caution='herbicide']")).toContainText("beans or peas");
    await expect(page.locator("[data-caution='lifting']")).toContainText("NIOSH");
    await expectAccessible(page, "detail-phone");
    await page.screenshot({ path: shots("detail-phone"), fullPage: true });
    await context.close();
  });

  test("no public page or response carries an exact pickup point or address", async ({ playwright, baseURL }) => {
    const rows = sql<{ id: string; lat: number; lng: number; address: string }>("SELECT id, lat, lng, address FROM listings WHERE status = 'active' ORDER BY id = ? DESC, id LIMIT 6", listingId);
    expect(rows[0].id).toBe(listingId);
    expect(rows[0].address).toBe(ADDRESS);
    // Signed in as someone else entirely, and signed out: neither may see them.
    for (const state of [undefined, storageState("gardener")]) {
      const request = await playwright.request.newContext({ baseURL, storageState: state });
      const bodies: string[] = [];
      for (const url of ["/browse", "/browse?material=leaves&lat=52.205&lng=0.847&radius_km=10", "/api/listings?limit=100", `/api/listings?lat=52.205&lng=0.847&radius_km=25&limit=100`]) {
        bodies.push(await (await request.get(url)).text());
      }
      for (const r of rows) {
        bodies.push(await (await request.get(`/listings/${r.id}`)).text(), await (await request.get(`/api/listings/${r.id}`)).text());
      }
      const all = bodies.join("\n");
      expect(all).toContain(listingId);
      for (const r of rows) {
        for (const secret of [r.address, String(r.lat), String(r.lng), `${r.lat.toFixed(5)}, ${r.lng.toFixed(5)}`]) expect(all, `${r.id}: ${secret}`).not.toContain(secret);
      }
      await request.dispose();
    }
    // The owner's own page does show them, so the check above can see a leak.
    const owner = await playwright.request.newContext({ baseURL, storageState: storageState("supplier") });
    const mine = await (await owner.get(`/listings/${listingId}`)).text();
    expect(mine).toContain(ADDRESS);
    await owner.dispose();
  });
});
