// What one side of a reservation may see, as the API and the pages return it. The exact
// address, the point and the other person's e-mail are added only for the owner's side
// and for the gardener of a confirmed (or later collected) reservation.
import type { ReservationContext } from "@/db/reservation-context";
import type { PaymentRow, ReservationEventRow } from "@/db/types";
import { allowedActions, owesPayment, type ReservationAction, type Side } from "./policy";
import { windowLabel } from "./pickup-times";
import { allowedOrderActions, estimatedWorms, postingState, type Fulfilment, type OrderAction, type OrderStage } from "./culture-orders";

export interface ReservationView {
  id: string;
  status: ReservationContext["status"];
  listing_id: string;
  quantity: number;
  unit: string;
  hold_expires_at: string | null;
  pickup_window_id: string | null;
  bed_id: string | null;
  group_id: string | null;
  created_at: string;
  updated_at: string;
  confirmed_at: string | null;
  closed_at: string | null;
  cancelled_by: string | null;
  amount_cents: number;
  deposit_cents: number;
  currency: string;
  payment: {
    state: ReservationContext["payment_state"];
    checkout_url: string | null;
    /**
     * Where the payment page stands while the payment is owed: "open"; "opening" (being made);
     * "not_opened" (Stripe could not be reached: the hold stays, the worker keeps trying and
     * e-mails the gardener, and the page can try again); "closed" once the reservation ended unpaid.
     */
    checkout: "open" | "opening" | "not_opened" | "closed" | null;
    /** One plain sentence about the payment when something needs saying (e.g. it could not be opened). */
    notice: string | null;
    problem: string | null;
    refunded_cents: number;
    captured_cents: number;
  };
  listing: { id: string; title: string; material: string; unit: string; unit_size: number | null; unit_mass_kg: number | null; location: { lat: number; lng: number } };
  supplier: { id: string; name: string; verified: boolean; email?: string };
  gardener: { id: string; name: string; email?: string };
  pickup: { window: string | null; starts_at: string | null; ends_by: string | null; address?: string; location?: { lat: number; lng: number } };
  pickup_code?: string | null;
  side: Side;
  actions: ReservationAction[];
  can_pay: boolean;
  can_review: boolean;
  my_review: { rating: number; comment: string } | null;
  their_review: { rating: number; comment: string } | null;
  history: { from: string | null; to: string; note: string | null; by: "gardener" | "supplier" | "duffbank"; at: string }[];
  /** Live cultures only: how it reaches the buyer and how far the parcel has got. */
  order: {
    fulfilment: Fulfilment;
    stage: OrderStage | null;
    /** The buyer's postal address: only the two parties ever see a reservation. */
    ship_to: string | null;
    carrier: string | null;
    tracking: string | null;
    shipped_at: string | null;
    estimated_count: number;
    actions: OrderAction[];
    /** Posted orders: whether today is one of the grower's posting days, the next one (YYYY-MM-DD), and the days by name. */
    posting: { today: boolean; next_day: string | null; paused: boolean; days: string[] } | null;
  } | null;
}

export interface ViewInput {
  r: ReservationContext;
  side: Side;
  viewerId: string;
  now: Date;
  payments: PaymentRow[];
  history: ReservationEventRow[];
  reviews: { author_id: string; rating: number; comment: string }[];
  /** The grower's posting pause, for whether "shipped" can be offered, and posting weekdays (0 Sunday) and their names. */
  shipping?: { paused: boolean; weekdays?: readonly number[]; ship_days?: string[] };
}

const REVEALED = new Set(["confirmed", "collected", "no_show"]);

function checkoutOf(r: ReservationContext, charge: PaymentRow | undefined): ReservationView["payment"]["checkout"] {
  if (!charge) return null;
  if (r.payment_state === "unpaid") return "closed";
  if (!owesPayment(r)) return null;
  if (charge.status === "open") return "open";
  if (charge.status === "creating") return charge.pending_action === "open" ? "not_opened" : "opening";
  return null;
}

function paymentNotice(r: ReservationContext, checkout: ReservationView["payment"]["checkout"], side: Side, now: Date): string | null {
  if (checkout === "not_opened" && r.hold_expires_at) {
    const minutes = Math.max(1, Math.ceil((new Date(r.hold_expires_at).getTime() - now.getTime()) / 60_000));
    return side === "gardener"
      ? `Held for ${minutes} min — payment could not be opened, try again. We keep trying too, and e-mail you when the payment page is ready.`
      : `Held for ${minutes} min — the gardener's payment page could not be opened yet.`;
  }
  if (checkout === "closed") return "Nothing was paid: the payment page was closed when the reservation ended.";
  return null;
}

export function reservationView({ r, side, viewerId, now, payments, history, reviews, shipping }: ViewInput): ReservationView {
  const charge = payments.find((p) => p.kind !== "refund");
  const refunded = payments.filter((p) => p.kind === "refund" && p.status === "succeeded").reduce((s, p) => s + p.amount_cents, 0);
  const reveal = side === "supplier" || REVEALED.has(r.status);
  // A posted culture never needs the grower's own address.
  const revealAddress = reveal && !(side === "gardener" && r.fulfilment === "post");
  const mine = reviews.find((v) => v.author_id === viewerId) ?? null;
  const theirs = reviews.find((v) => v.author_id !== viewerId) ?? null;
  const by = (actor: string | null) => (actor === null ? "duffbank" : actor === r.gardener_id ? "gardener" : "supplier");
  const checkout = checkoutOf(r, charge);
  return {
    id: r.id,
    status: r.status,
    listing_id: r.listing_id,
    quantity: r.quantity,
    unit: r.listing.unit,
    hold_expires_at: r.hold_expires_at,
    pickup_window_id: r.pickup_window_id,
    bed_id: side === "gardener" ? r.bed_id : null,
    group_id: r.group_id,
    created_at: r.created_at,
    updated_at: r.updated_at,
    confirmed_at: r.confirmed_at,
    closed_at: r.closed_at,
    cancelled_by: r.cancelled_by,
    amount_cents: r.amount_cents,
    deposit_cents: r.deposit_cents,
    currency: r.currency,
    payment: {
      state: r.payment_state,
      checkout_url: side === "gardener" && owesPayment(r) && charge?.status === "open" ? charge.checkout_url : null,
      checkout,
      notice: paymentNotice(r, checkout, side, now),
      // A card the gardener tried and Stripe declined (not Stripe being unreachable, which the notice covers).
      problem: owesPayment(r) && charge?.status === "open" ? (charge.last_error ?? null) : null,
      refunded_cents: Math.max(refunded, charge?.refunded_cents ?? 0),
      captured_cents: charge?.captured_cents ?? 0,
    },
    listing: {
      id: r.listing.id,
      title: r.listing.title,
      material: r.listing.material_code,
      unit: r.listing.unit,
      unit_size: r.listing.unit_size,
      unit_mass_kg: r.listing.unit_mass_kg,
      location: { lat: r.listing.approx_lat, lng: r.listing.approx_lng },
    },
    supplier: { id: r.supplier.id, name: r.supplier.name, verified: r.supplier.verified, ...(reveal ? { email: r.supplier.email } : {}) },
    gardener: { id: r.gardener.id, name: r.gardener.name, ...(REVEALED.has(r.status) ? { email: r.gardener.email } : {}) },
    pickup: {
      window: r.window ? windowLabel(r.window) : null,
      starts_at: r.pickup_at,
      ends_by: r.pickup_by,
      ...(revealAddress ? { address: r.listing.address, location: { lat: r.listing.lat, lng: r.listing.lng } } : {}),
    },
    ...(side === "gardener" && REVEALED.has(r.status) ? { pickup_code: r.pickup_code } : {}),
    side,
    actions: allowedActions(r, side, now),
    can_pay: side === "gardener" && owesPayment(r),
    can_review: r.status === "collected" && !mine,
    my_review: mine ? { rating: mine.rating, comment: mine.comment } : null,
    their_review: theirs ? { rating: theirs.rating, comment: theirs.comment } : null,
    history: history.map((h) => ({ from: h.from_status, to: h.to_status, note: h.note, by: by(h.actor_id), at: h.created_at })),
    order: r.fulfilment
      ? {
          fulfilment: r.fulfilment,
          stage: r.order_stage,
          ship_to: r.ship_to,
          carrier: r.carrier,
          tracking: r.tracking,
          shipped_at: r.shipped_at,
          estimated_count: estimatedWorms(r.quantity),
          actions: allowedOrderActions(r, side, { postingPaused: !!shipping?.paused }),
          posting: r.fulfilment === "post" && shipping?.weekdays ? { ...postingState(shipping.weekdays, !!shipping.paused, now), days: shipping.ship_days ?? [] } : null,
        }
      : null,
  };
}
