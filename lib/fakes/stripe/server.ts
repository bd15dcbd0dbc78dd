import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import qs from "qs";
import Stripe from "stripe";
import { matchApiRoute } from "./api-routes";
import { expireDueSessions } from "./checkout";
import { FakeStripeError, newId } from "./errors";
import { authenticate, canonicalJson, findIdempotent, readBody, sendJson, shouldSaveIdempotent } from "./http";
import { handlePay } from "./pay-handler";
import type { Ops } from "./payments";
import { createState, loadState, saveState } from "./state";
import type { FakeStripeState, RequestInfo } from "./types";
import { WebhookDispatcher, type RetrySchedule } from "./webhooks";
import { listenOn } from "../listen";

export interface StripeFakeOptions {
  /** 0 picks a free port. */
  port?: number;
  host?: "127.0.0.1";
  webhookUrl?: string | null;
  webhookSecret?: string;
  /** Where browsers reach the fake; the hosted page URLs are built from it. */
  publicBaseUrl?: string;
  /** Milliseconds since the epoch, like Date.now. Lets tests move time (session expiry). */
  now?: () => number;
  /** How failed webhook deliveries are retried; tests pass small numbers to stay fast. */
  retry?: RetrySchedule;
  /** JSON file to keep records across restarts; in memory only when absent. */
  dataFile?: string;
  log?: (line: string) => void;
}

export interface StripeFake {
  port: number;
  url: string;
  webhookSecret: string;
  state: FakeStripeState;
  setWebhookUrl(url: string | null): void;
  /** Resolves once every queued webhook has been delivered or given up (see RetrySchedule). */
  webhooksIdle(): Promise<void>;
  close(): Promise<void>;
}

export const DEFAULT_WEBHOOK_SECRET = "whsec_duffbank_local";
// Stripe retries a failed delivery with exponential backoff for up to three days. Locally
// the same, but capped at a minute apart, so an app restarted after an outage hears about
// what it missed within a minute.
export const DEFAULT_RETRY: RetrySchedule = { baseMs: 1_000, maxMs: 60_000 };
const SWEEP_INTERVAL_MS = 1000;

// qs's defaults cut nesting at depth 5 and turn arrays over 20 entries into objects;
// Stripe's shapes are deeper and a cart can have more lines.
const QS_OPTIONS = { depth: 20, arrayLimit: 1000, parameterLimit: 10_000 };

export async function startStripeFake(opts: StripeFakeOptions = {}): Promise<StripeFake> {
  const host = opts.host ?? "127.0.0.1";
  const now = opts.now ?? Date.now;
  const secret = opts.webhookSecret ?? DEFAULT_WEBHOOK_SECRET;
  const state = opts.dataFile ? loadState(opts.dataFile) : createState();
  const persist = () => {
    if (opts.dataFile) saveState(state, opts.dataFile);
  };
  const dispatcher = new WebhookDispatcher(state, {
    url: opts.webhookUrl ?? null,
    secret,
    // Events say which API version shaped them; use the one the installed SDK speaks.
    apiVersion: Stripe.API_VERSION,
    now,
    retry: opts.retry ?? DEFAULT_RETRY,
    onChange: persist,
    log: opts.log,
  });
  let publicBaseUrl = opts.publicBaseUrl ?? "";

  const opsFor = (request: RequestInfo | null): Ops => ({
    state,
    nowSeconds: () => Math.floor(now() / 1000),
    emit: (type, object) => dispatcher.emit(type, object, request),
  });
  const sweep = () => {
    if (expireDueSessions(opsFor(null)) > 0) persist();
  };

  async function handleApi(req: IncomingMessage, res: ServerResponse, url: URL): Promise<void> {
    const requestId = newId("req_");
    const method = req.method ?? "GET";
    const idempotencyKey = method === "POST" ? (req.headers["idempotency-key"] as string | undefined) ?? null : null;
    const headers: Record<string, string> = {
      "Request-Id": requestId,
      "Stripe-Version": (req.headers["stripe-version"] as string | undefined) ?? Stripe.API_VERSION,
    };
    if (idempotencyKey) headers["Idempotency-Key"] = idempotencyKey;
    try {
      // Read the body first so a refused request still leaves the connection reusable.
      const body = method === "POST" ? await readBody(req) : "";
      authenticate(req);
      const type = req.headers["content-type"] ?? "";
      if (body !== "" && !type.startsWith("application/x-www-form-urlencoded")) {
        throw new FakeStripeError(400, {
          type: "invalid_request_error",
          message: "The Stripe API takes form-encoded bodies (application/x-www-form-urlencoded), not JSON.",
        });
      }
      const params = qs.parse(method === "POST" ? body : url.search.slice(1), QS_OPTIONS) as Record<string, unknown>;
      const match = matchApiRoute(method, url.pathname);
      if (!match) {
        throw new FakeStripeError(404, {
          type: "invalid_request_error",
          message: `Unrecognized request URL (${method}: ${url.pathname}). The local fake implements Checkout Sessions, PaymentIntents, refunds, charges and events; see lib/fakes/stripe/README.md.`,
        });
      }
      const paramsJson = canonicalJson(params);
      if (idempotencyKey) {
        const earlier = findIdempotent(state, idempotencyKey, method, url.pathname, paramsJson);
        if (earlier) {
          sendJson(res, earlier.status, earlier.body, { ...headers, "Idempotent-Replayed": "true" });
          return;
        }
      }
      sweep();
      let status = 200;
      let answer: unknown;
      try {
        answer = match.handler({ ops: opsFor({ id: requestId, idempotencyKey }), publicBaseUrl }, params, match.ids);
      } catch (err) {
        if (!(err instanceof FakeStripeError)) throw err;
        status = err.status;
        answer = { error: { ...err.body, request_log_url: null } };
      }
      if (idempotencyKey && shouldSaveIdempotent(status)) {
        state.idempotency.set(idempotencyKey, { method, path: url.pathname, paramsJson, status, body: answer });
      }
      if (method === "POST") persist();
      sendJson(res, status, answer, headers);
    } catch (err) {
      if (err instanceof FakeStripeError) {
        sendJson(res, err.status, { error: err.body }, headers);
        return;
      }
      opts.log?.(`unexpected error on ${method} ${url.pathname}: ${err instanceof Error ? err.stack : String(err)}`);
      sendJson(res, 500, { error: { type: "api_error", message: "The local Stripe fake hit an unexpected error; see its log." } }, headers);
    }
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://fake.local");
    if (url.pathname.startsWith("/v1/")) return handleApi(req, res, url);
    const pay = /^\/pay\/(cs_test_[A-Za-z0-9]+)$/.exec(url.pathname);
    if (pay) {
      sweep();
      if (await handlePay(req, res, opsFor(null), pay[1])) persist();
      return;
    }
    if (url.pathname === "/health") return sendJson(res, 200, { ok: true });
    sendJson(res, 404, { error: { type: "invalid_request_error", message: `Nothing at ${url.pathname}.` } });
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((err) => {
      opts.log?.(`request failed: ${err instanceof Error ? err.stack : String(err)}`);
      if (!res.headersSent) sendJson(res, 500, { error: { type: "api_error", message: "Unexpected error." } });
      else res.destroy();
    });
  });
  const port = await listenOn(server, opts.port ?? 0, host);
  const url = `http://${host}:${port}`;
  publicBaseUrl = (publicBaseUrl || url).replace(/\/$/, "");
  const timer = setInterval(sweep, SWEEP_INTERVAL_MS);
  // The sweep must not keep a test run or a script alive on its own.
  timer.unref();
  // Deliveries a previous run left unfinished carry on, as Stripe's would have.
  const resumed = opts.dataFile ? dispatcher.resume() : 0;
  if (resumed > 0) opts.log?.(`resuming delivery of ${resumed} webhook event(s) from ${opts.dataFile}`);

  return {
    port,
    url,
    webhookSecret: secret,
    state,
    setWebhookUrl: (next) => dispatcher.setUrl(next),
    webhooksIdle: () => dispatcher.idle(),
    close: async () => {
      clearInterval(timer);
      dispatcher.close();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
    },
  };
}
