export const ROLES = ["gardener", "supplier", "grower", "council", "moderator"] as const;
export type Role = (typeof ROLES)[number];

/** Roles a person may ask for on their profile; the others are granted by staff. */
export const REQUESTABLE_ROLES = ["supplier", "grower"] as const satisfies readonly Role[];

/** Anyone who can post listings. */
export const LISTING_ROLES = ["supplier", "grower", "council"] as const satisfies readonly Role[];

export const ROLE_LABELS: Record<Role, string> = {
  gardener: "Bed builder",
  supplier: "Material giver",
  grower: "Worm grower",
  council: "Council staff",
  moderator: "Moderator",
};
