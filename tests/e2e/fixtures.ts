// What every journey imports instead of @playwright/test: the same `test` and `expect`, plus a
// watch on every browser context for Content-Security-Policy violations, so a journey fails
// when the policy (proxy.ts) blocks anything the app needs. Also the local inbox helpers.
import { expect, test as base, type APIRequestContext, type Browser, type BrowserContext } from "@playwright/test";
import { latestMail } from "./exchange";
import { expectNoAxeViolations } from "./axe";

const violations: string[] = [];
const watched = new WeakSet<BrowserContext>();

function watch(context: BrowserContext) {
  if (watched.has(context)) return;
  watched.add(context);
  context.on("console", (msg) => {
    const text = msg.text();
    if (/Content Security Policy|Content-Security-Policy/i.test(text)) violations.push(`${msg.page()?.url() ?? "?"}: ${text}`);
  });
  context.on("weberror", (err) => {
    if (/Content Security Policy/i.test(String(err.error()))) violations.push(`${err.page()?.url() ?? "?"}: ${String(err.error())}`);
  });
}

export const test = base.extend<{ cspWatch: void }, { browser: Browser }>({
  browser: [
    async ({ browser }, provide) => {
      const newContext = browser.newContext.bind(browser);
      browser.newContext = async (...args: Parameters<Browser["newContext"]>) => {
        const context = await newContext(...args);
        watch(context);
        return context;
      };
      await provide(browser);
    },
    { scope: "worker" },
  ],
  context: async ({ context }, provide) => {
    watch(context);
    await provide(context);
  },
  cspWatch: [
    async ({}, provide) => {
      violations.length = 0;
      await provide();
      expect(violations, "Content-Security-Policy violations in the browser console").toEqual([]);
    },
    { auto: true },
  ],
});

export { expect };
export type { Page, APIRequestContext, Browser } from "@playwright/test";

const escaped = (text: string) => new RegExp(text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"));

/** The newest message to `to` whose subject contains `subjectPart`, waiting for the worker to send it. */
export const mailTo = (request: APIRequestContext, to: string, subjectPart: string) => latestMail(request, to, escaped(subjectPart));

/** The first link in a message's text. */
export const firstLink = (mail: { text: string }) => mail.text.match(/https?:\/\/\S+/)![0];

/** Runs axe on the page as it is now and fails on any violation, naming each rule and where (./axe.ts). */
export const expectAccessible = (page: import("@playwright/test").Page, what: string) => expectNoAxeViolations(page, what);
