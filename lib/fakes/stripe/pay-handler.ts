import type { IncomingMessage, ServerResponse } from "node:http";
import qs from "qs";
import { getSession, paySession } from "./checkout";
import { renderClosedPage, renderMissingPage, renderPayPage } from "./checkout-page";
import { readBody, sendHtml } from "./http";
import type { Ops } from "./payments";
import { readCardForm, type CardForm } from "./test-cards";
import type { CheckoutSession } from "./types";

// The hosted checkout page: GET shows the form, POST takes the card details.
// Field problems re-show the form (422); a decline re-shows it with the reason (402) and
// leaves the session open for another card; approval redirects to success_url (303).

// What the buyer reads after a decline: plain words, and the fact that nothing was taken.
const DECLINE_WORDS: Record<string, string> = {
  generic_decline: "The card was declined. Nothing was charged — try a different card.",
  insufficient_funds: "The card was declined for insufficient funds. Nothing was charged — try a different card.",
};

function successUrl(session: CheckoutSession): string | null {
  return session.success_url?.replaceAll("{CHECKOUT_SESSION_ID}", session.id) ?? null;
}

/** The origin the approved payment redirects to, for the page's form-action policy. */
function successOrigin(session: CheckoutSession): string[] {
  try {
    return session.success_url ? [new URL(session.success_url.replace("{CHECKOUT_SESSION_ID}", "x")).origin] : [];
  } catch {
    return [];
  }
}

function pageInput(ops: Ops, session: CheckoutSession) {
  return {
    session,
    items: ops.state.sessionLineItems.get(session.id) ?? [],
    captureLater: ops.state.sessionIntentTemplates.get(session.id)?.capture_method === "manual",
  };
}

/** Returns true when state changed (so the caller can persist it). */
export async function handlePay(
  req: IncomingMessage,
  res: ServerResponse,
  ops: Ops,
  sessionId: string,
): Promise<boolean> {
  const session = ops.state.checkoutSessions.get(sessionId);
  if (!session) {
    sendHtml(res, 404, renderMissingPage());
    return false;
  }
  if (req.method === "GET" || req.method === "HEAD") {
    if (session.status === "open") sendHtml(res, 200, renderPayPage(pageInput(ops, session)), successOrigin(session));
    else sendHtml(res, session.status === "expired" ? 410 : 200, renderClosedPage(session, successUrl(session)));
    return false;
  }
  if (req.method !== "POST") {
    res.writeHead(405, { Allow: "GET, POST" }).end();
    return false;
  }

  const raw = qs.parse(await readBody(req)) as Record<string, unknown>;
  const form: CardForm = {};
  for (const key of ["card_number", "expiry", "cvc", "name"] as const) {
    if (typeof raw[key] === "string") form[key] = raw[key] as string;
  }
  if (session.status !== "open") {
    sendHtml(res, 409, renderClosedPage(session, successUrl(session)));
    return false;
  }
  // The CVC is never echoed back into the page, as card forms conventionally do.
  const values = { ...form, cvc: "" };
  const read = readCardForm(form, ops.nowSeconds());
  if (!read.ok) {
    sendHtml(res, 422, renderPayPage({ ...pageInput(ops, session), values, errors: read.errors }), successOrigin(session));
    return false;
  }
  const error = paySession(ops, sessionId, read.attempt);
  if (error) {
    const problem = DECLINE_WORDS[error.decline_code ?? ""] ?? "The card was declined. Nothing was charged.";
    sendHtml(res, 402, renderPayPage({ ...pageInput(ops, session), values, problem }), successOrigin(session));
    return true;
  }
  const done = getSession(ops, sessionId);
  const target = successUrl(done);
  if (target) res.writeHead(303, { Location: target, "Cache-Control": "no-store" }).end();
  else sendHtml(res, 200, renderClosedPage(done, null));
  return true;
}
