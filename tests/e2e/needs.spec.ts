import path from "node:path";
import { expect, firstLink, mailTo, test, expectAccessible } from "./fixtures";
import { storageState } from "./roles";
import { sql } from "./exchange";

// The demand side in a real browser: a gardener's bed far from any leaves turns its unmet
// leaves into an open need; a supplier posting leaves nearby sees, before publishing, that
// they serve one open need, and after, that they were matched to one gardener's need; the
// gardener gets the alert e-mail in the local inbox and reserves from it in one click, for
// the same bed. Then the council's demand map of the demo town.

const stamp = Date.now();
const BED = `North plot ${stamp % 100000}`;
const TITLE = `Hornbeam leaves ${stamp}`;
// About 22 km north of Fernhollow, well past every demo listing and every demo need's reach.
const FAR = { lat: 52.405, lng: 0.847 };
const shots = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "screens", `${name}.png`);

test.describe.serial("open needs", () => {
  let bedId = "";

  test("a bed's unmet leaves become an open need", async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState("gardener") });
    const page = await context.newPage();
    const start = new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10);
    const saved = await page.request.post("/api/beds", { data: { name: BED, bed: { length_m: 3, width_m: 1.2 }, start_date: start, location: FAR } });
    expect(saved.status()).toBe(201);
    bedId = (await saved.json()).bed.id;

    await page.goto(`/beds/${bedId}/materials`);
    await expect(page.getByRole("heading", { name: `Find materials for ${BED}` })).toBeVisible();
    await expect(page.getByText(/Still missing .* of fallen leaves/)).toBeVisible({ timeout: 20_000 });
    await page.getByRole("button", { name: "Tell me when someone lists fallen leaves nearby" }).click();
    const form = page.getByRole("form", { name: "Ask for fallen leaves" });
    // The unmet amount comes in bags: 3.6 m² × 12.5 cm = 0.45 m³, about four 30-gallon bags.
    await expect(form.getByLabel("How much")).toHaveValue("4");
    await form.getByLabel("How far you would go (km)").fill("5");
    await form.getByLabel("At once, for each listing").check();
    await expectAccessible(page, "needs-ask");
    await page.screenshot({ path: shots("needs-ask"), fullPage: true });
    await form.getByRole("button", { name: "Tell me when it is listed" }).click();
    await expect(page.locator("[data-open-need='leaves']")).toContainText("You have an open need for");

    await page.goto("/needs");
    const card = page.locator("[data-need]").filter({ hasText: BED });
    await expect(card).toContainText("Fallen leaves");
    await expect(card).toContainText("within 5 km");
    await expectAccessible(page, "needs-page");
    await page.screenshot({ path: shots("needs-page"), fullPage: true });
    await context.close();
  });

  test("a supplier posting leaves nearby sees that they serve one open need, then that they were matched", async ({ browser }) => {
    const context = await browser.newContext({ storageState: storageState("supplier") });
    const page = await context.newPage();
    await page.goto("/listings/new");
    await page.getByLabel("Material", { exact: true }).selectOption("leaves");
    await page.getByLabel("Title", { exact: true }).fill(TITLE);
    await page.getByLabel("Description", { exact: true }).fill("Raked off the lawn under two hornbeams, dry, in paper sacks.");
    await page.getByLabel("Quantity (bags)").fill("6");
    await page.getByLabel("Raked from gardens or a lawn").check();
    await page.getByText("Type the coordinates instead").click();
    await page.getByLabel("Latitude").fill(String(FAR.lat + 0.009));
    await page.getByLabel("Longitude").fill(String(FAR.lng + 0.004));
    await page.getByLabel("Pickup address").fill("2 Far Field Lane, Nettlecombe");
    const preview = page.locator("[data-demand-preview]");
    await expect(preview.locator("[data-ring='5']")).toHaveText(/serves 1 open need$/, { timeout: 15_000 });
    // One gardener: no amount is given for fewer than three.
    await expect(preview).not.toContainText("in all");
    await preview.scrollIntoViewIfNeeded();
    await expectAccessible(page, "needs-supplier-preview");
    await page.screenshot({ path: shots("needs-supplier-preview"), fullPage: true });
    await page.getByRole("button", { name: "Publish listing" }).click();
    await expect(page).toHaveURL(/\/listings\/[0-9a-f-]{36}$/);
    await expect(page.getByText("You have been matched to 1 gardener's need")).toBeVisible();
    await context.close();
  });

  test("the gardener gets the alert e-mail and reserves from it, for the same bed", async ({ browser, request }) => {
    const mail = await mailTo(request, "gardener@duffbank.test", BED);
    expect(mail.subject).toContain(TITLE);
    expect(mail.text).toMatch(/roadside/);
    const link = firstLink(mail);
    expect(link).toMatch(/\/needs\/alerts\/[0-9a-f-]{36}$/);

    const context = await browser.newContext({ storageState: storageState("gardener") });
    const page = await context.newPage();
    await page.goto(link);
    await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
    await expect(page.locator("[data-caution='roadside']")).toBeVisible();
    await expectAccessible(page, "needs-alert");
    await page.screenshot({ path: shots("needs-alert"), fullPage: true });
    await page.getByRole("button", { name: "Reserve 4 bags" }).click();
    await expect(page).toHaveURL(/\/reservations\?new=/, { timeout: 20_000 });
    const id = new URL(page.url()).searchParams.get("new")!;
    const [row] = sql<{ bed_id: string; need_id: string; quantity: number; status: string }>("SELECT bed_id, need_id, quantity, status FROM reservations WHERE id = ?", id);
    expect(row).toMatchObject({ bed_id: bedId, quantity: 4, status: "held" });
    const [need] = sql<{ bed_id: string; material_code: string }>("SELECT bed_id, material_code FROM needs WHERE id = ?", row.need_id);
    expect(need).toEqual({ bed_id: bedId, material_code: "leaves" });
    await context.close();
  });
});

test.describe("the council's demand map", () => {
  test.use({ storageState: storageState("council") });

  test("shows the demo town's areas of demand, a giveaway day that would fit, and the CSV", async ({ page }) => {
    await page.goto("/council");
    await expect(page.getByRole("heading", { name: "Who is waiting for material" })).toBeVisible();
    await page.getByRole("link", { name: "Demand map and CSV" }).click();
    await expect(page.getByRole("heading", { name: "Where residents need material" })).toBeVisible();
    const map = page.getByRole("region", { name: "Map of open needs by area" });
    await expect(map.locator("path.duff-demand-cell")).toHaveCount(2);
    await expect(page.locator("[data-suggestion]")).toContainText("households");
    await expect(page.locator("[data-map-key]")).toContainText("3 or more people");
    // Each area is named by the nearest place in the gazetteer, not only by coordinates.
    await expect(page.getByRole("table").locator("tbody tr").first()).toContainText(/^Near \w/);
    // A desk and a phone: the map, suggestion and table fit the width at both.
    for (const width of [1366, 390]) {
      await page.setViewportSize({ width, height: width > 500 ? 900 : 844 });
      await page.reload();
      await expect(map.locator("path.duff-demand-cell")).toHaveCount(2);
      // The shipped base map drawn under the areas (Leaflet adds its shapes to their own pane).
      await expect(map.locator(".leaflet-duff-basemap-pane path").first()).toBeAttached();
      expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
      await expectAccessible(page, `council-demand-${width}`);
      await page.screenshot({ path: shots(`council-demand-${width}`), fullPage: true });
    }
    const csv = await page.request.get("/api/council/demand.csv?material=leaves");
    expect(csv.headers()["content-type"]).toMatch(/text\/csv/);
    expect((await csv.text()).trim().split(/\r\n/)).toHaveLength(3);
    await page.getByRole("link", { name: "Plan this day" }).click();
    await expect(page.getByRole("heading", { name: "New giveaway day" })).toBeVisible();
    await expect(page.getByLabel("Slot 1 starts")).toHaveValue("09:00");
  });
});
