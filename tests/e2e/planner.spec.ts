import fs from "node:fs";
import path from "node:path";
import { seedId } from "../../seeds/ids";
import { expect, test, expectAccessible } from "./fixtures";
import { inboxMessages } from "./exchange";
import { DEMO, storageState } from "./roles";

test("a visitor plans a bed and switches units", async ({ page }) => {
  await page.goto("/plan");
  await page.getByLabel("Length (m)").fill("3");
  await page.getByLabel("Width (m)").fill("1.2");
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  const leaves = page.locator("tr[data-material='leaves']");
  // 3 m × 1.2 m × 12.5 cm = 0.45 m³ (volume = area × depth).
  await expect(leaves).toContainText("0.45 m³");
  await expect(page.getByText("3.6 m²").first()).toBeVisible();
  await expect(page.getByRole("heading", { name: "Take care" })).toBeVisible();
  await expect(page.getByText(/bean|pea/).first()).toBeVisible();
  await expectAccessible(page, "plan-metric");
  await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "plan-metric.png"), fullPage: true });

  // The first soak as a range in litres, with its middle and the squeeze test beside it.
  const water = page.locator("dt:has-text('Water for the first soak') ~ dd").first();
  await expect(water).toHaveText(/^\d+–\d+ L$/);
  await expect(page.getByTestId("water-note")).toContainText("squeezed handful");
  // Planting into it apart from its turning to soil (about 6–9 months, then a year).
  await expect(page.getByTestId("planting")).toContainText("You can plant into it from");
  await expect(page.locator("[data-step='plant_into']")).toBeVisible();
  await expect(page.locator("[data-step='ready']")).toContainText("Most of it has turned to soil");
  // Worms as a round figure, not to the worm.
  await expect(page.locator("tr[data-material='worms']")).toContainText(/about \d{1,2},\d00 worms/);
  // C:N advice a bed can follow: clippings no deeper than about 3 cm.
  await expect(page.getByTestId("blend-advice")).toContainText("no deeper than about 3 cm");

  await page.getByRole("main").getByRole("radio", { name: "Imperial" }).click();
  await expect(page.getByLabel("Length (ft)")).toHaveValue("9.84");
  await expect(leaves).toContainText("ft³");
  await expect(page.getByText("38.8 ft²").first()).toBeVisible();
  // The estimate is asked for again in the new units: water in gallons, advice in inches.
  await expect(water).toHaveText(/^\d+–\d+ US gal$/);
  await expect(page.getByTestId("blend-advice")).toContainText("1.2 in");
  await expectAccessible(page, "plan-imperial");
  await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "plan-imperial.png"), fullPage: true });

  // A limit comes back in the unit the gardener typed in.
  await page.getByLabel("Leaf depth (in)").fill("13");
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  await expect(page.locator("#field-leaves_depth-error")).toHaveText("depth must be at most 12 in");
  await page.getByLabel("Leaf depth (in)").fill("4.9");

  // Bad input gets a message beside the field, not a request.
  await page.getByLabel("Width (ft)").fill("-2");
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  await expect(page.locator("#field-width-error")).not.toBeEmpty();
});

test("switching metric → imperial → metric gives back the same defaults", async ({ page }) => {
  await page.goto("/plan");
  // The form fills in its defaults once the page has come alive.
  await expect(page.getByLabel("Length (m)")).toHaveValue("3");
  const before = await Promise.all(["Length (m)", "Width (m)", "Seam overlap (cm)", "Leaf depth (cm)", "Straw depth (cm)"].map((l) => page.getByLabel(l).inputValue()));
  await page.getByRole("main").getByRole("radio", { name: "Imperial" }).click();
  await expect(page.getByLabel("Leaf depth (in)")).toHaveValue("4.9");
  await page.getByRole("main").getByRole("radio", { name: "Metric" }).click();
  const after = await Promise.all(["Length (m)", "Width (m)", "Seam overlap (cm)", "Leaf depth (cm)", "Straw depth (cm)"].map((l) => page.getByLabel(l).inputValue()));
  expect(after).toEqual(before);
  expect(after[3]).toBe("12.5");
});

test("a visitor who places the bed sees what it will cost, the worms' price among it", async ({ page }) => {
  await page.goto("/plan");
  await page.getByLabel("Length (m)").fill("3");
  await page.getByLabel("Width (m)").fill("1.2");
  const map = page.getByRole("region", { name: /click where the bed is/ });
  await expect(map.locator(".leaflet-container")).toBeVisible();
  await map.scrollIntoViewIfNeeded();
  const box = (await map.boundingBox())!;
  await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
  await expect(page.getByText("Bed placed on the map")).toBeVisible();
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  const costs = page.getByTestId("bed-costs");
  await expect(costs).toBeVisible({ timeout: 20_000 });
  await expect(costs.locator("[data-cost='To pay suppliers']")).toHaveText(/€\d/);
  // Deposits only where a free listing asks one; this plan's may or may not.
  await expect(costs.locator("[data-cost='Deposits held']")).toHaveText(/^(€\d+\.\d\d|none)$/);
  // The demo's worms are priced: the worm line shows its price before anything is reserved.
  await expect(page.locator("td[data-cost-of='worms']")).toHaveText(/€\d+\.\d\d/);
  await expectAccessible(page, "plan-costs");
  await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "plan-costs.png"), fullPage: true });
});

test("a visitor draws a bed on the map", async ({ page }) => {
  await page.goto("/plan");
  await page.getByLabel("Draw it on the map").check();
  const map = page.getByRole("region", { name: /click each corner/ });
  await expect(map.locator(".leaflet-container")).toBeVisible();
  const box = (await map.boundingBox())!;
  // A square a third of the map across: at zoom 17 on a 420 × 288 px map that is about
  // 92 m × 63 m, well inside the 10,000 m² cap (40 % across would sit right at it).
  for (const [fx, fy] of [[0.35, 0.35], [0.65, 0.35], [0.65, 0.65], [0.35, 0.65]]) {
    await page.mouse.click(box.x + box.width * fx, box.y + box.height * fy);
  }
  await expect(page.getByText("4 corners placed.")).toBeVisible();
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  await expect(page.locator("tr[data-material='cardboard']")).toBeVisible();
  const area = await page.locator("dt:has-text('Bed area') + dd").textContent();
  expect(Number.parseFloat(area!.replace(/,/g, ""))).toBeGreaterThan(0);
});

test("a gardener saves a bed, downloads its calendar, and gets the reminder on the day", async ({ browser }) => {
  const context = await browser.newContext({ storageState: storageState("gardener"), acceptDownloads: true });
  const page = await context.newPage();
  await page.goto("/plan");
  await page.getByLabel("Length (m)").fill("2.5");
  await page.getByLabel("Width (m)").fill("1");
  await page.getByLabel("Build day").fill("2027-04-10");
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  await page.getByLabel("Save this bed as").fill("Sunny corner");
  await page.getByRole("button", { name: "Save bed" }).click();
  await expect(page.getByRole("heading", { name: "Sunny corner" })).toBeVisible();
  await expect(page.locator("tr[data-material='straw']")).toBeVisible();
  // Built in April 2027: not built yet today, plantable from October, soil by the next April.
  await expect(page.locator("[data-stage]")).toContainText("10 October 2027");

  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: /calendar \(\.ics\)/ }).click()]);
  const ics = fs.readFileSync((await download.path())!, "utf8");
  expect(ics).toContain("BEGIN:VCALENDAR");
  expect(ics).toContain("DTSTART;VALUE=DATE:20270410");
  expect(ics).toContain("Sunny corner: Build day");

  // Move the worker's clock to the build day; the reminder arrives in the local inbox.
  fs.writeFileSync(process.env.DUFFBANK_CLOCK_FILE!, "2027-04-10T07:30:00Z");
  await expect
    .poll(
      async () => {
        const messages = await inboxMessages(page.request, DEMO.gardener.email);
        return messages.map((m) => m.subject);
      },
      { timeout: 30_000 },
    )
    .toContain("Sunny corner: Build day");
  fs.rmSync(process.env.DUFFBANK_CLOCK_FILE!, { force: true });
  await context.close();
});

test("the mix calculator works out a blend", async ({ page }) => {
  await page.goto("/mix");
  // Amounts as people have them: the default is two barrows of leaves and a bucket of clippings.
  await expect(page.getByRole("button", { name: "Fallen leaves", exact: true })).toHaveAttribute("aria-pressed", "true");
  await page.getByRole("button", { name: "Work out the mix" }).click();
  await expect(page.getByTestId("balance")).toContainText("Heavy on browns");
  await expect(page.getByTestId("squeeze")).toContainText("Squeeze test:");
  // The per-material figures, their sources and the numbers sit behind one toggle.
  await expect(page.getByText("Water to add")).toHaveCount(0);
  await page.getByRole("button", { name: "Show the figures" }).click();
  await expect(page.getByText(/: 1$/).first()).toBeVisible();
  await expect(page.getByText("Water to add")).toBeVisible();
  await expect(page.getByText(/Source: .*NRAES/).first()).toBeVisible();
  // The calculator keeps its full advice: the mass of clippings that brings this pile to 40,
  // however much (a bed is told only what fits as a layer).
  await expect(page.getByTestId("mix-advice")).toContainText(/kg of grass clippings/);
});

test.describe("a gardener's saved bed", () => {
  test.use({ storageState: storageState("gardener") });

  test("shows its stage today, what it will cost, and its figures in either unit system", async ({ page }) => {
    await page.goto(`/beds/${seedId("bed:back-fence")}`);
    await expect(page.getByRole("heading", { name: "Back fence bed" })).toBeVisible();
    // Built on 1 March 2027: you can plant into it from 1 September 2027.
    await expect(page.locator("[data-stage]")).toContainText("1 September 2027");
    const costs = page.getByTestId("bed-costs");
    await expect(costs).toBeVisible();
    await expect(page.locator("td[data-cost-of='worms']")).toHaveText(/€\d+\.\d\d/);
    await expect(page.locator("dt:has-text('Water for the first soak') ~ dd").first()).toHaveText(/ L$/);
    await expectAccessible(page, "bed-metric");
    await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "bed-metric.png"), fullPage: true });
    await page.getByRole("main").getByRole("radio", { name: "Imperial" }).click();
    // The choice is this device's (a cookie), so the page comes back in it after a reload too.
    await page.reload();
    await expect(page.locator("dt:has-text('Water for the first soak') ~ dd").first()).toHaveText(/ US gal$/);
    await expect(page.locator("[data-step='top_up']").first()).toContainText("ft³");
    await expect(page.getByTestId("blend-advice")).toContainText(" in ");
    await expectAccessible(page, "bed-imperial");
    await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "bed-imperial.png"), fullPage: true });
  });
});
