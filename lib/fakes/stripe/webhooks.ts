import { createHmac } from "node:crypto";
import { newId } from "./errors";
import type { DeliveryAttempt, FakeStripeState, RequestInfo, StripeEvent, StripeObject } from "./types";

// Stripe signs `${timestamp}.${payload}` with HMAC-SHA256 keyed by the endpoint secret and
// sends `Stripe-Signature: t=<timestamp>,v1=<hex>` (docs.stripe.com/webhooks#verify-manually),
// which is exactly what stripe.webhooks.constructEvent checks.
export function signatureHeader(payload: string, secret: string, timestampSeconds: number): string {
  const v1 = createHmac("sha256", secret).update(`${timestampSeconds}.${payload}`, "utf8").digest("hex");
  return `t=${timestampSeconds},v1=${v1}`;
}

/**
 * When a failed delivery is tried again: after baseMs · 2^(attempt−1), never more than
 * maxMs apart, until the receiver answers 2xx. Like Stripe, which retries with backoff for
 * up to three days (docs.stripe.com/webhooks#retries), it stops once the event is maxAgeMs
 * old, or after maxAttempts when that is given (tests that want a quick give-up).
 */
export interface RetrySchedule {
  baseMs: number;
  maxMs?: number;
  maxAttempts?: number;
  maxAgeMs?: number;
}

export const STRIPE_RETRY_WINDOW_MS = 3 * 24 * 60 * 60_000;

/** The wait after failed attempt number `attempt` (1-based). */
export function retryDelayMs(attempt: number, schedule: RetrySchedule): number {
  return Math.min(schedule.maxMs ?? Infinity, schedule.baseMs * 2 ** Math.min(attempt - 1, 40));
}

export interface WebhookOptions {
  url: string | null;
  secret: string;
  apiVersion: string;
  /** Milliseconds since the epoch, like Date.now; also used for the signature timestamp. */
  now: () => number;
  retry: RetrySchedule;
  /** Called after a delivery changed the records (an event delivered), to save them. */
  onChange?: () => void;
  /** How long one delivery may take before it counts as failed. */
  timeoutMs?: number;
  log?: (line: string) => void;
}

/**
 * Records events and delivers them in the background. Each object (a session, an intent,
 * a refund) has its own queue, so its events arrive in the order they happened and a
 * retry for one object never holds back another's. Delivery never delays the API answer.
 */
export class WebhookDispatcher {
  private url: string | null;
  private readonly queues = new Map<string, Promise<void>>();
  private readonly timers = new Set<{ timer: NodeJS.Timeout; resolve: () => void }>();
  private readonly inFlight = new Set<AbortController>();
  private closed = false;

  constructor(
    private readonly state: FakeStripeState,
    private readonly opts: WebhookOptions,
  ) {
    this.url = opts.url;
  }

  setUrl(url: string | null): void {
    this.url = url;
  }

  emit(type: string, object: StripeObject, request: RequestInfo | null): StripeEvent {
    const event: StripeEvent = {
      id: newId("evt_"),
      object: "event",
      api_version: this.opts.apiVersion,
      created: Math.floor(this.opts.now() / 1000),
      // A snapshot: later changes to the object must not rewrite what this event said.
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.url ? 1 : 0,
      request: { id: request?.id ?? null, idempotency_key: request?.idempotencyKey ?? null },
      type,
    };
    this.state.events.set(event.id, event);
    if (this.url && !this.closed) this.enqueue(object.id, event);
    return event;
  }

  /**
   * Resolves once every queued delivery has succeeded or given up. With no maxAttempts a
   * receiver that keeps failing is retried for days: close() the fake rather than wait.
   */
  async idle(): Promise<void> {
    while (this.queues.size > 0) {
      await Promise.all([...this.queues.values()]);
    }
  }

  /** Queues again the events a previous run recorded but never delivered (a restart). */
  resume(): number {
    let n = 0;
    const events = [...this.state.events.values()].filter((e) => e.pending_webhooks > 0).sort((a, b) => a.created - b.created);
    for (const event of events) {
      if (!this.url || this.closed || this.tooOld(event)) continue;
      this.enqueue((event.data.object as { id: string }).id, event);
      n++;
    }
    return n;
  }

  close(): void {
    this.closed = true;
    for (const t of this.timers) {
      clearTimeout(t.timer);
      t.resolve();
    }
    this.timers.clear();
    for (const controller of this.inFlight) controller.abort();
  }

  private enqueue(objectId: string, event: StripeEvent): void {
    const previous = this.queues.get(objectId) ?? Promise.resolve();
    const next = previous.then(() => this.deliver(objectId, event));
    this.queues.set(objectId, next);
    void next.finally(() => {
      if (this.queues.get(objectId) === next) this.queues.delete(objectId);
    });
  }

  private async deliver(objectId: string, event: StripeEvent): Promise<void> {
    const payload = JSON.stringify(event, null, 2);
    const maxAttempts = this.opts.retry.maxAttempts ?? Infinity;
    for (let attempt = 1; ; attempt++) {
      const url = this.url;
      if (this.closed || !url) return;
      const result = await this.attempt(objectId, event, payload, url, attempt);
      if (result.ok) {
        const stored = this.state.events.get(event.id);
        if (stored) stored.pending_webhooks = 0;
        this.opts.onChange?.();
        return;
      }
      const delay = retryDelayMs(attempt, this.opts.retry);
      if (attempt >= maxAttempts || this.tooOld(event, delay)) {
        this.opts.log?.(`webhook ${event.type} ${event.id} gave up after ${attempt} attempts`);
        this.opts.onChange?.();
        return;
      }
      const why = result.status !== null ? `HTTP ${result.status}` : result.error;
      this.opts.log?.(`webhook ${event.type} ${event.id} to ${url}: attempt ${attempt} failed (${why}); retrying in ${delay} ms`);
      await this.sleep(delay);
    }
  }

  /** Whether the next try (`afterMs` from now) would fall outside the retry window. */
  private tooOld(event: StripeEvent, afterMs = 0): boolean {
    return this.opts.now() + afterMs - event.created * 1000 > (this.opts.retry.maxAgeMs ?? STRIPE_RETRY_WINDOW_MS);
  }

  private async attempt(
    objectId: string,
    event: StripeEvent,
    payload: string,
    url: string,
    attempt: number,
  ): Promise<DeliveryAttempt> {
    const controller = new AbortController();
    this.inFlight.add(controller);
    const timeout = setTimeout(() => controller.abort(), this.opts.timeoutMs ?? 10_000);
    const at = this.opts.now();
    const record = { eventId: event.id, type: event.type, objectId, attempt, url, at };
    try {
      const res = await fetch(url, {
        method: "POST",
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "User-Agent": "Stripe/1.0 (+https://stripe.com/docs/webhooks) duffbank-local-fake",
          "Stripe-Signature": signatureHeader(payload, this.opts.secret, Math.floor(at / 1000)),
        },
        body: payload,
        // Stripe counts a redirect as a failed delivery; following it would hide that.
        redirect: "manual",
        signal: controller.signal,
      });
      await res.arrayBuffer().catch(() => undefined);
      const done: DeliveryAttempt = { ...record, status: res.status, ok: res.status >= 200 && res.status < 300 };
      this.state.deliveries.push(done);
      return done;
    } catch (err) {
      const error = err instanceof Error ? (err.cause instanceof Error ? err.cause.message : err.message) : String(err);
      const failed: DeliveryAttempt = { ...record, status: null, ok: false, error };
      this.state.deliveries.push(failed);
      return failed;
    } finally {
      clearTimeout(timeout);
      this.inFlight.delete(controller);
    }
  }

  private sleep(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const entry = {
        timer: setTimeout(() => {
          this.timers.delete(entry);
          resolve();
        }, ms),
        resolve,
      };
      // A pending retry must never keep a process (a test run, a script) alive on its own.
      entry.timer.unref();
      this.timers.add(entry);
    });
  }
}
