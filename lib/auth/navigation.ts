import type { Role } from "./roles";

export interface NavLink {
  href: string;
  label: string;
}

// Each entry appears once a person holds one of its roles; public entries always appear.
const LINKS: { href: string; label: string; roles: Role[] | "public" }[] = [
  { href: "/plan", label: "Plan a bed", roles: "public" },
  { href: "/mix", label: "Mix calculator", roles: "public" },
  { href: "/browse", label: "Browse", roles: "public" },
  { href: "/giveaways", label: "Giveaway days", roles: "public" },
  { href: "/beds", label: "My beds", roles: ["gardener"] },
  { href: "/reservations", label: "My reservations", roles: ["gardener"] },
  { href: "/needs", label: "My needs", roles: ["gardener"] },
  { href: "/listings/mine", label: "What I'm giving", roles: ["supplier", "grower", "council"] },
  { href: "/requests", label: "Requests", roles: ["supplier", "grower", "council"] },
  { href: "/grower", label: "Worm cultures", roles: ["grower"] },
  { href: "/reports", label: "Passed on", roles: ["supplier", "grower", "council"] },
  { href: "/council", label: "Council desk", roles: ["council"] },
  { href: "/moderation", label: "Moderation", roles: ["moderator"] },
];

/** The main navigation for a person (null: signed out). */
export function navFor(roles: readonly Role[] | null): NavLink[] {
  return LINKS.filter((l) => l.roles === "public" || (roles && l.roles.some((r) => roles.includes(r)))).map(({ href, label }) => ({ href, label }));
}
