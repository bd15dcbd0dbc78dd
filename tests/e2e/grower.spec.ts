// A worm culture end to end in Chromium: the listing says how it arrives and when parcels go
// out; a gardener orders it by post and pays on the local checkout page; the care sheet
// arrives; the grower accepts, packs and ships it from the dashboard; the shipped e-mail
// carries the carrier and tracking; the buyer marks it arrived.
import path from "node:path";
import { expect, test, type Page, expectAccessible } from "./fixtures";
import { latestMail, payOnCheckoutPage, sql } from "./exchange";
import { storageState } from "./roles";

const shot = (name: string) => path.join(process.env.E2E_DIR ?? "test-results", "shots", `${name}.png`);
const PHONE = { width: 390, height: 844 };

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

test("a gardener buys a worm culture by post, the grower packs and ships it, and the care sheet and tracking arrive", async ({ browser, request }) => {
  test.setTimeout(150_000);
  const grower = sql<{ id: string }>("select id from users where email = 'grower@duffbank.test'")[0];
  // One of the grower's cultures sold in 0.5 kg packs at €16.00 (seeds/listings.ts), so the
  // order below is one whole pack whatever else the demo holds.
  const culture = sql<{ id: string; title: string; pack_size: number; pack_price_cents: number }>(
    `select id, title, pack_size, pack_price_cents from listings where owner_id = ? and material_code = 'worms' and status = 'active'
     and pack_size is not null and pack_price_cents = 1600 order by quantity_total - quantity_held - quantity_collected desc limit 1`,
    grower.id,
  )[0];
  expect(culture).toMatchObject({ id: expect.any(String), title: expect.any(String) });
  expect([Number(culture.pack_size), Number(culture.pack_price_cents)]).toEqual([0.5, 1600]);

  const g = await browser.newContext({ storageState: storageState("grower") });
  const dash = await g.newPage();
  // Posting open on the demo's Monday and Tuesday, whatever an earlier journey left behind.
  expect((await dash.request.put("/api/grower/shipping", { data: { ship_weekdays: [1, 2], paused: false } })).status()).toBe(200);

  // The listing says what a buyer gets and how it reaches them.
  const b = await browser.newContext({ storageState: storageState("gardener") });
  const page = await b.newPage();
  await page.goto(`/listings/${culture.id}`);
  const facts = page.getByTestId("culture-facts");
  await expect(facts).toContainText(/[\d,]+ worms left/);
  await expect(facts).toContainText("about 1,000 a pound");
  await expect(facts).toContainText("Eisenia fetida");
  await expect(page.locator("dt:text-is('Price') + dd")).toHaveText("€16.00 a 0.5 kg pack");
  await expect(facts).toContainText("Collect from the grower or Posted to you");
  await expect(facts.getByTestId("posting-days")).toContainText(/Parcels go out on Monday and Tuesday.*goes out on (Monday|Tuesday) \d+ \w+ at the earliest/);
  const report = page.getByRole("link", { name: "Report this supplier" });
  await expect(report).toHaveAttribute("href", `/report?user=${grower.id}`);
  await expectAccessible(page, "grower-listing");
  await page.screenshot({ path: shot("grower-listing"), fullPage: true });
  await page.setViewportSize(PHONE);
  await expectAccessible(page, "grower-listing-phone");
  await page.screenshot({ path: shot("grower-listing-phone"), fullPage: true });
  await report.click();
  await expect(page.getByRole("heading", { name: "Report a problem" })).toBeVisible();
  await expect(page.getByText(/Wrenfield Worms/).first()).toBeVisible();

  // Ordering by post: the address, no pickup window, pay 4242 on the local checkout page.
  await page.goto(`/listings/${culture.id}/reserve`);
  await page.getByLabel("How many packs").fill("1");
  await expect(page.getByText("That is 0.5 kg of worms in all.")).toBeVisible();
  await page.getByLabel("Post them to me").check();
  await expect(page.getByText("When you will collect")).toHaveCount(0);
  await page.getByRole("button", { name: "Reserve and pay €16.00" }).click();
  await expect(page.getByText(/full postal address/)).toBeVisible(); // the address is required
  await page.getByLabel("Postal address").fill("Flat 3, 21 Quarry Row\nFernhollow FH2 7QT");
  await expectAccessible(page, "grower-order-phone");
  await page.screenshot({ path: shot("grower-order-phone"), fullPage: true });
  await page.getByRole("button", { name: "Reserve and pay €16.00" }).click();
  await page.waitForURL(/\/pay\/cs_test_/);
  await payOnCheckoutPage(page, "4242 4242 4242 4242");
  await expect(page.getByRole("heading", { level: 1, name: "Paid" })).toBeVisible({ timeout: 20_000 });

  const care = await latestMail(request, "gardener@duffbank.test", new RegExp(`^Care sheet: 0\\.5 kg of ${escape(culture.title)}`));
  expect(care.text).toContain("Eisenia fetida");
  expect(care.text).toMatch(/squeeze/i);
  expect(care.text).toContain("55–78 °F");
  expect(care.text).toContain("half their body weight");
  expect(care.text).toContain("7–14 days after building it");
  expect(care.text).toContain("invasive in some regions");
  expect(care.text).toContain("local rules");

  // The grower's dashboard: the order with the buyer's address; accept, pack, ship.
  const id = sql<{ id: string }>("select id from reservations where listing_id = ? order by created_at desc limit 1", culture.id)[0].id;
  await dash.goto("/grower");
  const order = dash.locator(`#o-${id}`);
  await expect(order).toContainText("For Ines Okafor");
  await expect(order.getByTestId("ship-to")).toContainText("21 Quarry Row");
  await expect(dash.getByTestId("orders-summary")).toContainText(/Next posting day: (Monday|Tuesday)/);
  await order.getByRole("button", { name: "Accept" }).click();
  await expect(order.getByRole("button", { name: "Mark packed" })).toBeVisible();
  await order.getByRole("button", { name: "Mark packed" }).click();
  await expect(order.getByRole("button", { name: "Mark shipped" })).toBeVisible();
  await order.getByRole("button", { name: "Mark shipped" }).click();
  await expect(order.getByText("Name the carrier: the postal service or a courier.")).toBeVisible();
  await order.getByLabel("Carrier").fill("Fernhollow Parcel Post");
  await order.getByLabel("Tracking number or link").fill("FPP 1234 5678 5");
  await expectAccessible(dash, "grower-dashboard");
  await dash.screenshot({ path: shot("grower-dashboard"), fullPage: true });
  await order.getByRole("button", { name: "Mark shipped" }).click();
  await expect(order.getByTestId("tracking")).toHaveText("FPP 1234 5678 5");
  await expect(order.getByRole("button", { name: "Mark delivered" })).toBeVisible();
  await dash.setViewportSize(PHONE);
  await expectAccessible(dash, "grower-dashboard-phone");
  await dash.screenshot({ path: shot("grower-dashboard-phone"), fullPage: true });
  await order.screenshot({ path: shot("grower-order-card-phone") });

  const shipped = await latestMail(request, "gardener@duffbank.test", new RegExp(`^Shipped: 0\\.5 kg of ${escape(culture.title)}`));
  expect(shipped.text).toContain("Carrier: Fernhollow Parcel Post");
  expect(shipped.text).toContain("Tracking: FPP 1234 5678 5");
  expect(shipped.text).toContain("21 Quarry Row");
  await latestMail(request, "gardener@duffbank.test", new RegExp(`^Packed: 0\\.5 kg of ${escape(culture.title)}`));

  // The buyer follows it on their reservations and says when it has come.
  await page.goto(`/reservations#r-${id}`);
  const mine = page.locator(`#r-${id}`);
  await expect(mine).toContainText("In the post with Fernhollow Parcel Post");
  await expect(mine.locator('[aria-current="step"]')).toContainText("In the post");
  // What matters for live animals on the way: the temperatures, and opening the box at once.
  await expect(mine.getByRole("list", { name: "The culture's journey" })).toContainText("55–78 °F");
  await expect(mine.getByRole("list", { name: "The culture's journey" })).toContainText("Open the box within a day");
  await expectAccessible(page, "grower-buyer-phone");
  await page.screenshot({ path: shot("grower-buyer-phone"), fullPage: true });
  await expectAccessible(page, "a culture order on the buyer's reservations, by phone");
  await mine.getByRole("button", { name: "It has arrived" }).click();
  await expect(mine).toContainText(/Delivered /);
  const done = sql<{ status: string; order_stage: string; quantity: number | string }>("select status, order_stage, quantity from reservations where id = ?", id)[0];
  expect({ ...done, quantity: Number(done.quantity) }).toEqual({ status: "collected", order_stage: "delivered", quantity: 0.5 });
  await latestMail(request, "grower@duffbank.test", new RegExp(`^Delivered: 0\\.5 kg of ${escape(culture.title)}`));

  await g.close();
  await b.close();
});
