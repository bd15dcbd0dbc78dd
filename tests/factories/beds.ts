import { db, newId, nowIso } from "@/db/index";
import type { BedRow } from "@/db/beds";
import { defined } from "./defined";
import { createUser } from "./users";

export type BedOpts = Partial<Omit<BedRow, "shape" | "recipe">> & {
  /** The bed's outline as the planner stores it (written as JSON). */
  shape?: Record<string, unknown>;
  recipe?: Record<string, unknown>;
};

/** A 2 m × 1 m bed with no place and no start date, owned by a new gardener unless `owner_id` is given. */
export async function createBed(opts: BedOpts = {}) {
  const { shape, recipe, ...columns } = opts;
  const owner_id = opts.owner_id ?? (await createUser({ roles: ["gardener"] })).id;
  const id = opts.id ?? newId();
  const at = opts.created_at ?? nowIso();
  await db()("beds").insert({
    name: "Test bed",
    area_m2: 2,
    lat: null,
    lng: null,
    start_date: null,
    created_at: at,
    updated_at: at,
    ...defined(columns),
    shape: JSON.stringify(shape ?? { length_m: 2, width_m: 1 }),
    recipe: JSON.stringify(recipe ?? {}),
    id,
    owner_id,
  });
  return { id, owner_id };
}
