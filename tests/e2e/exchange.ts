// Helpers the exchange journeys share: reading the e2e database, paying on the Stripe fake's
// local checkout page, and waiting for an e-mail in the local inbox.
import Database from "better-sqlite3";
import { expect, type APIRequestContext, type Page } from "@playwright/test";
import { inboxUrl } from "./roles";

export function sql<T = any>(query: string, ...args: unknown[]): T[] {
  const conn = new Database(process.env.DATABASE_FILE!);
  try {
    return conn.prepare(query).all(...args) as T[];
  } finally {
    conn.close();
  }
}

export function run(query: string, ...args: unknown[]) {
  const conn = new Database(process.env.DATABASE_FILE!);
  try {
    conn.prepare(query).run(...args);
  } finally {
    conn.close();
  }
}

export async function payOnCheckoutPage(page: Page, card: string) {
  await expect(page.getByText("Local test payment page")).toBeVisible();
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry (MM/YY)").fill(`12/${String((new Date().getFullYear() + 1) % 100).padStart(2, "0")}`);
  await page.getByLabel("CVC").fill("123");
  await page.getByLabel("Name on card").fill("Ines Okafor");
  await page.getByRole("button", { name: /^Pay / }).click();
}

/** The newest message to `to` whose subject matches, waiting for it to arrive. */
export async function latestMail(request: APIRequestContext, to: string, subject: RegExp, timeout = 30_000) {
  let found: { subject: string; text: string; html: string | null } | undefined;
  await expect
    .poll(
      async () => {
        const { messages } = await (await request.get(`${inboxUrl()}/messages.json?to=${encodeURIComponent(to)}`)).json();
        found = messages.filter((m: { subject: string }) => subject.test(m.subject)).pop();
        return !!found;
      },
      { timeout },
    )
    .toBe(true);
  return found!;
}
