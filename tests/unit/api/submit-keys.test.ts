// The client side of retry-safe writes: one Idempotency-Key per submit, kept only while the
// same request is sent again after its answer was lost, and resent by apiFetch itself.
import { afterEach, describe, expect, it, vi } from "vitest";
import { ApiClientError, SubmitKeys, apiFetch, submitOnce } from "@/lib/api/client";

afterEach(() => vi.unstubAllGlobals());

const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

describe("SubmitKeys", () => {
  it("keeps the key for the same request after a lost answer, and only then", () => {
    const keys = new SubmitKeys();
    const a = keys.keyFor("/api/reservations", { quantity: 1 });
    keys.settle(new ApiClientError(0, "network", "offline"));
    expect(keys.keyFor("/api/reservations", { quantity: 1 })).toBe(a);
    expect(keys.keyFor("/api/reservations", { quantity: 2 })).not.toBe(a); // a different request
    const b = keys.keyFor("/api/reservations", { quantity: 2 });
    keys.settle(new ApiClientError(409, "insufficient_quantity", "gone")); // an answer came back
    expect(keys.keyFor("/api/reservations", { quantity: 2 })).not.toBe(b);
  });
});

describe("apiFetch with an Idempotency-Key", () => {
  it("sends the request again with the same key when the connection drops", async () => {
    const seen: (string | null)[] = [];
    let calls = 0;
    vi.stubGlobal("fetch", async (_url: string, init: RequestInit) => {
      seen.push(new Headers(init.headers).get("idempotency-key"));
      if (++calls === 1) throw new TypeError("network connection was lost");
      return json(201, { reservation: { id: "r1" } });
    });
    const keys = new SubmitKeys();
    expect(await submitOnce(keys, "/api/reservations", { body: { quantity: 1 } })).toEqual({ reservation: { id: "r1" } });
    expect(seen).toHaveLength(2);
    expect(seen[0]).toMatch(/^[0-9a-f-]{36}$/);
    expect(seen[1]).toBe(seen[0]);
  });

  it("waits for a first request the server says is still running", async () => {
    let calls = 0;
    vi.stubGlobal("fetch", async () => (++calls === 1 ? json(409, { error: { code: "request_in_progress", message: "busy" } }) : json(201, { ok: 1 })));
    expect(await apiFetch("/api/reservations", { body: {}, idempotencyKey: "k" })).toEqual({ ok: 1 });
    expect(calls).toBe(2);
  });

  it("never resends a request without a key", async () => {
    let calls = 0;
    vi.stubGlobal("fetch", async () => {
      calls++;
      throw new TypeError("offline");
    });
    await expect(apiFetch("/api/listings", { body: {} })).rejects.toMatchObject({ code: "network" });
    expect(calls).toBe(1);
  });
});
