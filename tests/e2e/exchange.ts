// Helpers the exchange journeys share: reading the e2e database (either engine), paying on the Stripe fake's
// local checkout page, and waiting for an e-mail in the local inbox.
import { expect, type APIRequestContext, type Page } from "@playwright/test";
import { otherConnection } from "../helpers/engine";
import { inboxUrl } from "./roles";

/** The e2e run's database: its PostgreSQL database when DATABASE_URL is set, else its SQLite file. */
const database = () => otherConnection(process.env.DATABASE_URL ? { DATABASE_URL: process.env.DATABASE_URL } : { DATABASE_FILE: process.env.DATABASE_FILE! });

export function sql<T = any>(query: string, ...args: unknown[]): T[] {
  const conn = database();
  try {
    return conn.all<T>(query, args);
  } finally {
    conn.close();
  }
}

export function run(query: string, ...args: unknown[]) {
  const conn = database();
  try {
    conn.run(query, args);
  } finally {
    conn.close();
  }
}

/** On Duffbank's local test checkout, press the outcome that sends this test card. */
export async function payOnCheckoutPage(page: Page, card: string) {
  await expect(page.getByRole("heading", { name: "Duffbank's local test checkout" })).toBeVisible();
  await page.getByRole("button", { name: new RegExp(card.replace(/\s/g, " ")) }).click();
}

/** The same, typed by hand into the test checkout's own form. */
export async function typeOnCheckoutPage(page: Page, card: string) {
  await page.getByText("Or type a test card by hand").click();
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry (MM/YY)").fill(`12/${String((new Date().getFullYear() + 1) % 100).padStart(2, "0")}`);
  await page.getByLabel("CVC").fill("123");
  await page.getByLabel("Name on card").fill("Ines Okafor");
  await page.getByRole("button", { name: /^Pay / }).click();
}

export interface InboxMessage {
  subject: string;
  text: string;
  html: string | null;
}

/**
 * The local inbox's messages to `to`, asked on a fresh connection each time. A kept-alive
 * socket can be closed by the inbox's server just as the next poll sends on it (a socket
 * hang-up that says nothing about the app); such a poll reads as "nothing yet", and the next
 * one asks again.
 */
export async function inboxMessages(request: APIRequestContext, to: string): Promise<InboxMessage[]> {
  try {
    const res = await request.get(`${inboxUrl()}/messages.json?to=${encodeURIComponent(to)}`, { headers: { connection: "close" } });
    return (await res.json()).messages;
  } catch (err) {
    if (/ECONNRESET|socket hang up/.test(String((err as Error).message))) return [];
    throw err;
  }
}

/** The newest message to `to` whose subject matches, waiting for it to arrive. */
export async function latestMail(request: APIRequestContext, to: string, subject: RegExp, timeout = 30_000) {
  let found: InboxMessage | undefined;
  await expect
    .poll(
      async () => {
        const messages = await inboxMessages(request, to);
        found = messages.filter((m) => subject.test(m.subject)).pop();
        return !!found;
      },
      { timeout },
    )
    .toBe(true);
  return found!;
}
