import type { Role } from "./roles";

export interface NavLink {
  href: string;
  label: string;
}

/** A few menus by task, so every role's navigation fits one row on a laptop. */
export const NAV_GROUPS = ["Build a bed", "Find material", "Give material", "Council", "Moderation"] as const;
export type NavGroupName = (typeof NAV_GROUPS)[number];
export interface NavGroup {
  label: NavGroupName;
  links: NavLink[];
}

// Each entry appears once a person holds one of its roles; public entries always appear.
const LINKS: { href: string; label: string; roles: Role[] | "public"; group: NavGroupName }[] = [
  { href: "/plan", label: "Plan a bed", roles: "public", group: "Build a bed" },
  { href: "/mix", label: "Mix a pile", roles: "public", group: "Build a bed" },
  { href: "/browse", label: "Browse", roles: "public", group: "Find material" },
  { href: "/giveaways", label: "Giveaway days", roles: "public", group: "Find material" },
  { href: "/beds", label: "My beds", roles: ["gardener"], group: "Build a bed" },
  { href: "/reservations", label: "My reservations", roles: ["gardener"], group: "Find material" },
  { href: "/needs", label: "My needs", roles: ["gardener"], group: "Find material" },
  { href: "/listings/mine", label: "What I'm giving", roles: ["supplier", "grower", "council"], group: "Give material" },
  { href: "/requests", label: "Requests", roles: ["supplier", "grower", "council"], group: "Give material" },
  { href: "/grower", label: "Worm cultures", roles: ["grower"], group: "Give material" },
  { href: "/reports", label: "Passed on", roles: ["supplier", "grower", "council"], group: "Give material" },
  { href: "/council", label: "Council desk", roles: ["council"], group: "Council" },
  { href: "/moderation", label: "Moderation", roles: ["moderator"], group: "Moderation" },
];

const visible = (roles: readonly Role[] | null) => LINKS.filter((l) => l.roles === "public" || (roles && l.roles.some((r) => roles.includes(r))));

/** The main navigation for a person (null: signed out). */
export function navFor(roles: readonly Role[] | null): NavLink[] {
  return visible(roles).map(({ href, label }) => ({ href, label }));
}

/** Up to this many links stand in a row as they are; more are gathered into menus by task. */
export const FLAT_NAV_MAX = 5;

/**
 * The same links gathered into menus by task, in NAV_GROUPS order. A group with one link
 * stands as that link (an entry with no `links`), and a short navigation is not grouped.
 */
export function navGroupsFor(roles: readonly Role[] | null): (NavGroup | NavLink)[] {
  const links = visible(roles);
  if (links.length <= FLAT_NAV_MAX) return links.map(({ href, label }) => ({ href, label }));
  return NAV_GROUPS.flatMap((label): (NavGroup | NavLink)[] => {
    const inGroup = links.filter((l) => l.group === label).map(({ href, label: text }) => ({ href, label: text }));
    if (inGroup.length === 0) return [];
    return inGroup.length === 1 ? [inGroup[0]] : [{ label, links: inGroup }];
  });
}
