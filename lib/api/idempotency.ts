import "server-only";
import { createHash } from "node:crypto";
import { setTimeout as sleep } from "node:timers/promises";
import { NextResponse } from "next/server";
import { claimIdempotencyKey, completeIdempotencyKey, findIdempotencyKey, type IdempotencyRow } from "@/db/idempotency-keys";
import type { SessionUser } from "@/lib/auth/current-user";
import { ApiError } from "./errors";
import { readText, toErrorResponse, type HandlerArgs } from "./handler";

// Retry-safe writes. A money-moving route wrapped in idempotent() honours an Idempotency-Key
// header: the first request with a key runs, and its answer is kept for a day; the same key
// from the same person again gets that first answer (marked Idempotent-Replayed: true) and
// changes nothing, however many times a lost connection makes the client send it; the same
// key with another method, path or body is a 409. Without the header a request runs as usual.
// A second request arriving while the first still runs waits a few seconds for its answer.
//
// The key is taken in its own write before the request runs, and the answer stored after:
// if the process dies in between, the key stays "running" and a retry is told so (409)
// rather than run twice, because the first may have gone through.

export const IDEMPOTENCY_TTL_MS = 24 * 3_600_000;
export const IDEMPOTENCY_HEADER = "idempotency-key";
// How long a retry waits for the first request with its key to finish before answering 409.
const WAIT_FOR_FIRST_MS = 10_000;
// No request runs this long (outside calls give up after seconds): a key still "running" after
// it belongs to a request whose process died, and whether it went through is not known here.
const ABANDONED_AFTER_MS = 2 * 60_000;
const POLL_MS = 100;
const KEY = /^[\x21-\x7e]{1,255}$/; // printable ASCII, no spaces, as Stripe's keys

type Handler<P> = (args: HandlerArgs<P> & { user: SessionUser }) => Promise<Response>;

/** JSON with its keys sorted, so the same body sent again with other spacing or key order still matches. */
function canonical(text: string): string {
  if (!text.trim()) return "";
  try {
    const sort = (v: unknown): unknown =>
      Array.isArray(v) ? v.map(sort) : v && typeof v === "object" ? Object.fromEntries(Object.entries(v as object).sort(([a], [b]) => (a < b ? -1 : 1)).map(([k, x]) => [k, sort(x)])) : v;
    return JSON.stringify(sort(JSON.parse(text)));
  } catch {
    return text;
  }
}

function replay(row: IdempotencyRow): Response {
  return new NextResponse(row.response_body ?? "", {
    status: row.response_status ?? 500,
    headers: { "content-type": "application/json", "idempotent-replayed": "true" },
  });
}

function assertSameRequest(row: IdempotencyRow, method: string, path: string, hash: string) {
  if (row.method !== method || row.path !== path || row.request_hash !== hash) {
    throw new ApiError("idempotency_mismatch", "This Idempotency-Key was already used for a different request. Send a new key with a new request.");
  }
}

/** The first answer for a key another request holds: waited for briefly, else a 409. */
async function answerOfFirst(userId: string, key: string, method: string, path: string, hash: string): Promise<Response> {
  const until = Date.now() + WAIT_FOR_FIRST_MS;
  for (;;) {
    const row = await findIdempotencyKey(userId, key);
    if (!row) throw new ApiError("request_in_progress", "A request with this Idempotency-Key has just ended without an answer; try again.");
    assertSameRequest(row, method, path, hash);
    if (row.state === "done") return replay(row);
    if (Date.now() - new Date(row.created_at).getTime() > ABANDONED_AFTER_MS) {
      throw new ApiError(
        "request_in_progress",
        "The first request with this Idempotency-Key never finished, so it may or may not have gone through. Check before trying again with a new key.",
      );
    }
    if (Date.now() >= until) {
      throw new ApiError(
        "request_in_progress",
        "The first request with this Idempotency-Key has not finished. Wait a moment and send it again with the same key (check your reservations first if it never finishes).",
      );
    }
    await sleep(POLL_MS);
  }
}

export function idempotent<P>(fn: Handler<P>): Handler<P> {
  return async (args) => {
    const key = args.req.headers.get(IDEMPOTENCY_HEADER);
    if (key === null) return fn(args);
    if (!KEY.test(key)) {
      throw new ApiError("bad_request", "The Idempotency-Key header must be 1 to 255 printable characters without spaces.", { "Idempotency-Key": "Use a fresh random value (a UUID) for each new request." });
    }
    const method = args.req.method;
    const path = args.req.nextUrl.pathname;
    // A copy of the body, read within the same 1 MB limit as the handler's own read.
    const hash = createHash("sha256").update(canonical(await readText(args.req.clone()))).digest("hex");
    const now = new Date();
    const claimed = await claimIdempotencyKey({
      user_id: args.user.id,
      idem_key: key,
      method,
      path,
      request_hash: hash,
      created_at: now.toISOString(),
      expires_at: new Date(now.getTime() + IDEMPOTENCY_TTL_MS).toISOString(),
    });
    if (!claimed) return answerOfFirst(args.user.id, key, method, path, hash);
    let res: Response;
    try {
      res = await fn(args);
    } catch (err) {
      // Errors become their envelope here, so the stored answer is exactly what was sent.
      res = toErrorResponse(err);
    }
    try {
      await completeIdempotencyKey(args.user.id, key, res.status, await res.clone().text(), new Date().toISOString());
    } catch (err) {
      // The answer still goes out; a retry with this key is told the first did not finish.
      console.error(`[idempotency] could not keep the answer for key ${key}:`, (err as Error).message);
    }
    return res;
  };
}
