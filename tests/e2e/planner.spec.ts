import fs from "node:fs";
import path from "node:path";
import { expect, test } from "./fixtures";
import { DEMO, inboxUrl, storageState } from "./roles";

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
  await page.screenshot({ path: path.join(process.env.E2E_DIR ?? "test-results", "plan-metric.png"), fullPage: true });

  await page.getByRole("radio", { name: /Imperial/ }).click();
  await expect(page.getByLabel("Length (ft)")).toHaveValue("9.84");
  await expect(leaves).toContainText("ft³");
  await expect(page.getByText("38.8 ft²").first()).toBeVisible();

  // Bad input gets a message beside the field, not a request.
  await page.getByLabel("Width (ft)").fill("-2");
  await page.getByRole("button", { name: "Work out what it takes" }).click();
  await expect(page.locator("#field-width-error")).not.toBeEmpty();
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
        const res = await page.request.get(`${inboxUrl()}/messages.json?to=${encodeURIComponent(DEMO.gardener.email)}`);
        const { messages } = await res.json();
        return messages.map((m: { subject: string }) => m.subject);
      },
      { timeout: 30_000 },
    )
    .toContain("Sunny corner: Build day");
  fs.rmSync(process.env.DUFFBANK_CLOCK_FILE!, { force: true });
  await context.close();
});

test("the mix calculator works out a blend", async ({ page }) => {
  await page.goto("/mix");
  await page.getByRole("button", { name: "Work out the mix" }).click();
  await expect(page.getByText(/: 1$/).first()).toBeVisible();
  await expect(page.getByText("Water to add")).toBeVisible();
});
