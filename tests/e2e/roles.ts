import fs from "node:fs";
import path from "node:path";

export const DEMO_PASSWORD = "duffbank-demo";

export const DEMO = {
  gardener: { email: "gardener@duffbank.test", nav: ["Plan a bed", "Browse", "Giveaway days", "My beds", "My reservations"], notNav: ["Council desk", "Moderation", "Requests", "Passed on"] },
  supplier: { email: "supplier@duffbank.test", nav: ["Browse", "My beds", "My reservations", "What I'm giving", "Requests", "Passed on"], notNav: ["Council desk", "Moderation", "Worm cultures"] },
  grower: { email: "grower@duffbank.test", nav: ["What I'm giving", "Requests", "Worm cultures", "Passed on"], notNav: ["Council desk", "Moderation"] },
  council: { email: "council@duffbank.test", nav: ["Council desk", "What I'm giving", "Requests", "Passed on"], notNav: ["Moderation", "My beds", "My reservations", "Worm cultures"] },
  moderator: { email: "moderator@duffbank.test", nav: ["Moderation", "Giveaway days"], notNav: ["Council desk", "My beds", "My reservations", "Requests", "Passed on"] },
} as const;

export type DemoRole = keyof typeof DEMO;

const dir = path.join(process.env.E2E_DIR ?? "test-results", "auth");
export function storageState(role: DemoRole): string {
  fs.mkdirSync(dir, { recursive: true });
  return path.join(dir, `${role}.json`);
}

export const inboxUrl = () => `http://127.0.0.1:${process.env.INBOX_PORT}`;
