import "server-only";
import type { SessionUser } from "@/lib/auth/current-user";
import { LISTING_ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { REPORT_REASON_LABELS } from "@/lib/validation/moderation";
import { listReservations } from "@/lib/services/reservations/list-reservations";
import { growerOrders } from "@/lib/services/growers/list-grower-orders";
import { councilOf } from "@/lib/auth/council-access";
import { councilDays } from "@/lib/services/giveaways/list-council-days";
import { reportQueue } from "@/db/reports";
import { pendingRoleRequests } from "@/db/organisations";
import type { ReservationView } from "@/lib/reservations/view";
import { PICKUP_TIME_ZONE } from "@/lib/reservations/pickup-times";
import { localDate } from "@/lib/time/zoned";
import { resolveContext, type Context } from "@/lib/context";

/** One thing that waits for the person: what it is, where to act on it, and when. */
export interface WaitingItem {
  label: string;
  href: string;
  when?: string | null;
}

/** A group of waiting things for one of the person's roles: "Requests to answer (2)". */
export interface WaitingSection {
  id: string;
  title: string;
  /** How many there are (the list may show only the first few). */
  count: number;
  items: WaitingItem[];
  /** Where the whole list lives. */
  more: { href: string; label: string };
  /** Said when there are none. */
  empty: string;
}

const FIRST = 5;
const section = (s: Omit<WaitingSection, "count" | "items"> & { all: WaitingItem[] }): WaitingSection => ({
  id: s.id,
  title: s.title,
  more: s.more,
  empty: s.empty,
  count: s.all.length,
  items: s.all.slice(0, FIRST),
});

const link = (v: ReservationView) => `/reservations/${v.id}`;
const onDay = (iso: string | null, day: string) => !!iso && localDate(new Date(iso), PICKUP_TIME_ZONE) === day;

/**
 * What is waiting for a signed-in person, for each role they hold: the gardener's payments
 * owed and pickups due, the supplier's requests to answer and today's pickups, the grower's
 * orders to pack, the council's bookings on its next days, the moderator's open reports.
 */
export async function whatsWaiting(user: SessionUser, ctx: Context = {}): Promise<WaitingSection[]> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const today = localDate(now, PICKUP_TIME_ZONE);
  const roles = user.roles;
  const out: WaitingSection[] = [];

  if (roles.includes("gardener")) {
    const mine = await listReservations(user.id, "gardener", {}, { db: q, clock: () => now });
    out.push(
      section({
        id: "to-pay",
        title: "To pay or put a deposit on",
        more: { href: "/reservations", label: "All my reservations" },
        empty: "Nothing is waiting for your payment.",
        all: mine.filter((v) => v.can_pay).map((v) => ({ label: `${v.listing.title} — from ${v.supplier.name}`, href: link(v), when: v.hold_expires_at })),
      }),
      section({
        id: "to-collect",
        title: "Pickups to make",
        more: { href: "/reservations", label: "All my reservations" },
        empty: "No pickups confirmed yet.",
        all: mine
          .filter((v) => v.status === "confirmed" && v.order?.fulfilment !== "post")
          .sort((a, b) => (a.pickup.starts_at ?? "").localeCompare(b.pickup.starts_at ?? ""))
          .map((v) => ({ label: `${onDay(v.pickup.starts_at, today) ? "Today: " : ""}${v.listing.title} — from ${v.supplier.name}`, href: link(v), when: v.pickup.starts_at })),
      }),
      section({
        id: "awaiting-answer",
        title: "Waiting for a supplier's answer",
        more: { href: "/reservations", label: "All my reservations" },
        empty: "No request is waiting for an answer.",
        all: mine.filter((v) => v.status === "held" && !v.can_pay).map((v) => ({ label: `${v.listing.title} — ${v.supplier.name} answers by`, href: link(v), when: v.hold_expires_at })),
      }),
    );
  }

  if (roles.some((r) => (LISTING_ROLES as readonly Role[]).includes(r))) {
    const theirs = await listReservations(user.id, "supplier", {}, { db: q, clock: () => now });
    out.push(
      section({
        id: "to-answer",
        title: "Requests to answer",
        more: { href: "/requests", label: "All requests" },
        empty: "No requests are waiting for your answer.",
        all: theirs.filter((v) => v.status === "held" && v.actions.includes("confirm")).map((v) => ({ label: `${v.gardener.name} asks for ${v.listing.title} — answer by`, href: link(v), when: v.hold_expires_at })),
      }),
      section({
        id: "pickups-today",
        title: "Pickups today",
        more: { href: "/requests", label: "All requests" },
        empty: "Nobody is due to collect today.",
        all: theirs
          .filter((v) => v.status === "confirmed" && onDay(v.pickup.starts_at, today))
          .map((v) => ({ label: `${v.gardener.name} collects ${v.listing.title}`, href: link(v), when: v.pickup.starts_at })),
      }),
    );
  }

  if (roles.includes("grower")) {
    const { orders } = await growerOrders(user.id, { db: q, clock: () => now });
    out.push(
      section({
        id: "to-pack",
        title: "Orders to pack or post",
        more: { href: "/grower", label: "Worm cultures" },
        empty: "No orders are waiting to be packed or posted.",
        all: orders
          .filter((v) => v.order?.actions.some((a) => a === "pack" || a === "ship"))
          .map((v) => ({ label: `${v.order!.actions.includes("pack") ? "Pack" : "Post"} ${v.listing.title} for ${v.gardener.name}`, href: link(v) })),
      }),
    );
  }

  if (roles.includes("council")) {
    if (user.organisation?.kind === "council") {
      const days = (await councilDays(councilOf(user), { db: q, clock })).filter((d) => d.status !== "cancelled" && d.date >= today).sort((a, b) => a.date.localeCompare(b.date));
      out.push(
        section({
          id: "giveaway-days",
          title: "Coming giveaway days",
          more: { href: "/council", label: "Council desk" },
          empty: "No giveaway day is coming up.",
          all: days.map((d) => {
            const booked = d.slots.reduce((n, s) => n + s.booked, 0);
            return { label: `${d.date === today ? "Today: " : ""}${d.title} — ${booked} ${booked === 1 ? "household" : "households"} booked`, href: `/council/giveaways/${d.id}/${d.date === today ? "check-in" : "sheet"}` };
          }),
        }),
      );
    }
  }

  if (roles.includes("moderator")) {
    const [reports, requests] = await Promise.all([reportQueue("open", q), pendingRoleRequests(q)]);
    out.push(
      section({
        id: "reports",
        title: "Reports to handle",
        more: { href: "/moderation", label: "Moderation" },
        empty: "No open reports.",
        all: reports.map((r) => ({ label: `${REPORT_REASON_LABELS[r.reason]}: ${r.listing_title ?? r.subject_name ?? "a report"} — from ${r.reporter_name}`, href: "/moderation", when: r.created_at })),
      }),
      section({
        id: "role-requests",
        title: "Roles to decide on",
        more: { href: "/moderation", label: "Moderation" },
        empty: "No one is waiting for a role.",
        all: requests.map((r) => ({ label: `${r.name} asks to be: ${ROLE_LABELS[r.role as Role] ?? r.role}`, href: "/moderation", when: r.created_at })),
      }),
    );
  }
  return out;
}
