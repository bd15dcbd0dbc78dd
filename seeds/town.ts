// Fernhollow: the invented market town the demo lives in. Every person, business, street
// and number here is made up.
export const TOWN = { name: "Fernhollow", centre: { lat: 52.205, lng: 0.847 }, currency: "eur" } as const;

export const STREETS = [
  "Tanner's Walk",
  "Cobble Row",
  "Lantern Hill",
  "Mill Leat Lane",
  "Orchard Rise",
  "Heron Quay",
  "Saltbox Street",
  "Wicker Close",
  "Bellfounder Road",
  "Juniper Steps",
  "Greyfriars Yard",
  "Thistle Crescent",
];

export const DEMO_PASSWORD = "duffbank-demo";

export interface DemoPerson {
  key: string;
  email: string;
  name: string;
  roles: ("gardener" | "supplier" | "grower" | "council" | "moderator")[];
  org?: { key: string; role: "owner" | "staff" };
  verified?: boolean;
  unit_system?: "metric" | "imperial";
}

export const ORGANISATIONS = [{ key: "council", name: "Fernhollow Town Council", kind: "council" as const }];

// The first five are the README's demo accounts, one per role.
export const PEOPLE: DemoPerson[] = [
  { key: "gardener", email: "gardener@duffbank.test", name: "Ines Okafor", roles: ["gardener"] },
  { key: "supplier", email: "supplier@duffbank.test", name: "Rowan Pike", roles: ["gardener", "supplier"], verified: true },
  { key: "grower", email: "grower@duffbank.test", name: "Wrenfield Worms (Hal Brisco)", roles: ["gardener", "grower"], verified: true },
  { key: "council", email: "council@duffbank.test", name: "Dana Whitlock", roles: ["council"], org: { key: "council", role: "owner" }, verified: true },
  { key: "moderator", email: "moderator@duffbank.test", name: "Sol Ferreira", roles: ["moderator"] },
  { key: "council2", email: "parks@duffbank.test", name: "Marek Hollis", roles: ["council"], org: { key: "council", role: "staff" }, verified: true },
  { key: "cycles", email: "cycles@duffbank.test", name: "Cobble Row Cycles", roles: ["supplier"], verified: true },
  { key: "farm", email: "hartwell@duffbank.test", name: "Hartwell Farm", roles: ["supplier"], verified: true },
  { key: "cafe", email: "bramblegate@duffbank.test", name: "Bramblegate Café", roles: ["supplier"] },
  { key: "trees", email: "oakhurst@duffbank.test", name: "Oakhurst Tree Care", roles: ["supplier"], verified: true },
  { key: "stables", email: "mossbank@duffbank.test", name: "Mossbank Stables", roles: ["supplier"] },
  { key: "maeve", email: "maeve@duffbank.test", name: "Maeve Lindqvist", roles: ["gardener", "supplier"] },
  { key: "tobias", email: "tobias@duffbank.test", name: "Tobias Arkwright", roles: ["gardener", "supplier"], unit_system: "imperial" },
  { key: "priya", email: "priya@duffbank.test", name: "Priya Nandakumar", roles: ["gardener", "supplier"] },
  // Households with open needs (seeds/needs.ts), so the council's demand map has areas to show.
  { key: "hazel", email: "hazel@duffbank.test", name: "Hazel Penrose", roles: ["gardener"] },
  { key: "idris", email: "idris@duffbank.test", name: "Idris Kettleby", roles: ["gardener"] },
  { key: "juno", email: "juno@duffbank.test", name: "Juno Achterberg", roles: ["gardener"] },
  { key: "kit", email: "kit@duffbank.test", name: "Kit Marwood", roles: ["gardener"] },
  { key: "lorna", email: "lorna@duffbank.test", name: "Lorna Sallow", roles: ["gardener"], unit_system: "imperial" },
  { key: "nico", email: "nico@duffbank.test", name: "Nico Brightwater", roles: ["gardener"] },
  { key: "oona", email: "oona@duffbank.test", name: "Oona Fairweather", roles: ["gardener"] },
  { key: "pim", email: "pim@duffbank.test", name: "Pim Vasquez-Lowe", roles: ["gardener"] },
];
