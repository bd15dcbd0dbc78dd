// The one environment module (lib/env.ts, lib/env-shared.ts): each variable read once, through
// zod, when asked; values that were always read leniently still fall back to their defaults.
import { afterEach, describe, expect, it, vi } from "vitest";
import { LOCAL_CLOUDINARY_URL, authUrl, type Env, dbEnvironment, fillCloudinaryUrl, readEnv, startupProblems } from "@/lib/env";
import { sharedEnv } from "@/lib/env-shared";

afterEach(() => {
  vi.unstubAllEnvs();
});

describe("readEnv", () => {
  it("reads numbers leniently: a value unfit for its use counts as unset", () => {
    expect(readEnv({ HOLD_MINUTES: "5", PASSWORD_HASH_COST: "12", SMTP_PORT: "2525", WORKER_INTERVAL_MS: "250", DATABASE_POOL_MAX: "4" })).toMatchObject({
      HOLD_MINUTES: 5,
      PASSWORD_HASH_COST: 12,
      SMTP_PORT: 2525,
      WORKER_INTERVAL_MS: 250,
      DATABASE_POOL_MAX: 4,
    });
    const bad = readEnv({ HOLD_MINUTES: "0", PASSWORD_HASH_COST: "9", SMTP_PORT: "70000", WORKER_INTERVAL_MS: "soon", DATABASE_POOL_MAX: "" });
    expect([bad.HOLD_MINUTES, bad.PASSWORD_HASH_COST, bad.SMTP_PORT, bad.WORKER_INTERVAL_MS, bad.DATABASE_POOL_MAX]).toEqual([undefined, undefined, undefined, undefined, undefined]);
  });

  it("never refuses a production start over a lenient value", () => {
    const secrets = { NEXTAUTH_SECRET: "a".repeat(40), LOCATION_SECRET: "b".repeat(40), STRIPE_WEBHOOK_SECRET: "c".repeat(40) };
    expect(startupProblems({ NODE_ENV: "production", ...secrets, HOLD_MINUTES: "soon", SMTP_PORT: "x" })).toEqual([]);
    expect(startupProblems({ NODE_ENV: "production", ...secrets, APP_URL: "ftp://x" })).toHaveLength(1);
  });

  it("sees a variable changed at run time", () => {
    vi.stubEnv("MAIL_FROM", "First <a@example.org>");
    expect(readEnv().MAIL_FROM).toBe("First <a@example.org>");
    vi.stubEnv("MAIL_FROM", "  ");
    expect(readEnv().MAIL_FROM).toBeUndefined();
  });
});

describe("accessors", () => {
  it("authUrl is NEXTAUTH_URL, else the app's URL", () => {
    expect(authUrl({ NEXTAUTH_URL: "https://auth.example.org", APP_URL: "https://app.example.org" })).toBe("https://auth.example.org");
    expect(authUrl({ APP_URL: "https://app.example.org/" })).toBe("https://app.example.org");
    expect(authUrl({ PORT: "4000" })).toBe("http://localhost:4000");
  });

  it("dbEnvironment: DUFFBANK_DB_ENV, else from NODE_ENV, test only where asked for", () => {
    expect(dbEnvironment({ DUFFBANK_DB_ENV: "staging", NODE_ENV: "production" })).toBe("staging");
    expect(dbEnvironment({ NODE_ENV: "production" })).toBe("production");
    expect(dbEnvironment({ NODE_ENV: "test" })).toBe("development");
    expect(dbEnvironment({ NODE_ENV: "test" }, { forTests: true })).toBe("test");
    expect(dbEnvironment({})).toBe("development");
  });

  it("fillCloudinaryUrl fills in the local fake only when nothing is set", () => {
    const unset: Env = { CLOUDINARY_URL: "" };
    fillCloudinaryUrl(unset);
    expect(unset.CLOUDINARY_URL).toBe(LOCAL_CLOUDINARY_URL);
    const set: Env = { CLOUDINARY_URL: "cloudinary://k:s@real" };
    fillCloudinaryUrl(set);
    expect(set.CLOUDINARY_URL).toBe("cloudinary://k:s@real");
  });

  it("sharedEnv reads the values a browser bundle may see, empty as unset", () => {
    vi.stubEnv("NEXT_PUBLIC_TILE_URL", "https://tiles.example.org/{z}/{x}/{y}.png");
    vi.stubEnv("PICKUP_TIME_ZONE", "");
    expect(sharedEnv()).toMatchObject({ NEXT_PUBLIC_TILE_URL: "https://tiles.example.org/{z}/{x}/{y}.png", PICKUP_TIME_ZONE: undefined });
  });
});
