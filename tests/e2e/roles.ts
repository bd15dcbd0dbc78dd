import fs from "node:fs";
import path from "node:path";

export const DEMO_PASSWORD = "duffbank-demo";

export const DEMO = {
  gardener: { email: "gardener@duffbank.test", nav: ["Plan a bed", "Browse", "My beds", "My reservations"], notNav: ["Council desk", "Moderation", "Requests"] },
  supplier: { email: "supplier@duffbank.test", nav: ["Browse", "My beds", "My reservations", "What I'm giving", "Requests"], notNav: ["Council desk", "Moderation"] },
  grower: { email: "grower@duffbank.test", nav: ["What I'm giving", "Requests"], notNav: ["Council desk", "Moderation"] },
  council: { email: "council@duffbank.test", nav: ["Council desk", "What I'm giving", "Requests"], notNav: ["Moderation", "My beds", "My reservations"] },
  moderator: { email: "moderator@duffbank.test", nav: ["Moderation"], notNav: ["Council desk", "My beds", "My reservations", "Requests"] },
} as const;

export type DemoRole = keyof typeof DEMO;

const dir = path.join(process.env.E2E_DIR ?? "test-results", "auth");
export function storageState(role: DemoRole): string {
  fs.mkdirSync(dir, { recursive: true });
  return path.join(dir, `${role}.json`);
}

export const inboxUrl = () => `http://127.0.0.1:${process.env.INBOX_PORT}`;
