import { describe, expect, it } from "vitest";
import { backoffDelayMs, nextCooldownMs } from "@/lib/time/backoff";

// Doubling from a base up to a cap: exponential backoff as commonly practised (common practice, no source).
const policy = { baseMs: 1_000, maxMs: 5_000 };

describe("waiting before trying again", () => {
  it("doubles the wait after each failure, up to the cap", () => {
    expect([0, 1, 2, 3, 4, 10].map((n) => backoffDelayMs(n, policy))).toEqual([1_000, 1_000, 2_000, 4_000, 5_000, 5_000]);
  });
  it("starts a cool-down at the base and doubles it, up to the cap", () => {
    expect(nextCooldownMs(0, policy)).toBe(1_000);
    expect(nextCooldownMs(1_000, policy)).toBe(2_000);
    expect(nextCooldownMs(4_000, policy)).toBe(5_000);
  });
});
