import type { Knex } from "knex";
import { MATERIALS } from "../lib/calc/facts";
import { approximatePoint, placeOwner } from "../lib/geo/approximate";
import { unitPriceOfPack } from "../lib/listings/packs";
import { demoListings } from "./listings";
import { DEMO_PASSWORD, ORGANISATIONS, PEOPLE, TOWN } from "./town";
import { seedId } from "./ids";
import { seedCommunity } from "./community";
import { seedPastPickups } from "./exchanges";
import { seedNeeds } from "./needs";
import { hashPassword } from "../lib/auth/password";
import { addPlaces } from "../db/places";
import { gazetteerEntries } from "./gazetteer";

// The demo scenario. Idempotent: every row has a fixed id and is written with
// "insert or ignore", so a second run changes nothing, and rows people made while trying
// the demo are left alone. Materials are the exception: their facts follow lib/calc.

const CREATED = "2026-11-01T09:00:00.000Z";

/** The materials table follows lib/calc's facts; listings refer to it, so tests load it too. */
export async function seedMaterials(knex: Knex): Promise<void> {
  for (const m of Object.values(MATERIALS)) {
    await knex("materials")
      .insert({
        code: m.code,
        name: m.name,
        n_pct: m.n_pct,
        cn_ratio: m.cn_ratio,
        moisture_pct: m.moisture_pct,
        bulk_density_kg_m3: m.bulk_density_kg_m3,
        default_unit: m.default_unit,
        source: m.source,
      })
      .onConflict("code")
      .merge();
  }
}

export async function seed(knex: Knex): Promise<Record<string, number>> {
  await knex.transaction(async (trx) => {
    await seedMaterials(trx);

    for (const org of ORGANISATIONS) {
      await trx("organisations")
        .insert({ id: seedId(`org:${org.key}`), name: org.name, kind: org.kind, created_at: CREATED })
        .onConflict("id")
        .ignore();
    }

    const existing = new Set((await trx("users").select("id")).map((r: { id: string }) => r.id));
    // One hash for every demo account, at the same cost as every other (lib/auth/password.ts).
    const hash = await hashPassword(DEMO_PASSWORD);
    for (const p of PEOPLE) {
      const id = seedId(`user:${p.key}`);
      if (!existing.has(id)) {
        await trx("users")
          .insert({
            id,
            email: p.email,
            display_name: p.name,
            password_hash: hash,
            email_verified_at: CREATED,
            unit_system: p.unit_system ?? "metric",
            reminders_opt_out: false,
            verified_at: p.verified ? CREATED : null,
            created_at: CREATED,
            updated_at: CREATED,
          })
          .onConflict("email")
          .ignore();
      }
      for (const role of p.roles) {
        await trx("user_roles").insert({ user_id: id, role, status: "active", created_at: CREATED }).onConflict(["user_id", "role"]).ignore();
      }
      if (p.org) {
        await trx("memberships")
          .insert({ organisation_id: seedId(`org:${p.org.key}`), user_id: id, org_role: p.org.role, created_at: CREATED })
          .onConflict(["organisation_id", "user_id"])
          .ignore();
      }
    }

    for (const l of demoListings()) {
      const id = seedId(l.key);
      const approx = approximatePoint({ owner: placeOwner({ organisation_id: l.org ? seedId(`org:${l.org}`) : null, owner_id: seedId(`user:${l.owner}`) }), lat: l.lat, lng: l.lng });
      await trx("listings")
        .insert({
          id,
          owner_id: seedId(`user:${l.owner}`),
          organisation_id: l.org ? seedId(`org:${l.org}`) : null,
          material_code: l.material,
          title: l.title,
          description: l.description,
          status: "active",
          unit: l.unit,
          unit_size: l.unit_size,
          unit_mass_kg: l.unit_mass_kg,
          quantity_total: l.quantity_total,
          price_cents: l.pack ? unitPriceOfPack(l.pack) : l.price_cents,
          currency: TOWN.currency,
          deposit_cents: l.deposit_cents,
          max_per_reservation: l.max_per_reservation,
          pack_size: l.pack?.size ?? null,
          pack_price_cents: l.pack?.price_cents ?? null,
          auto_accept: l.auto_accept,
          lat: l.lat,
          lng: l.lng,
          address: l.address,
          approx_lat: approx.lat,
          approx_lng: approx.lng,
          available_from: CREATED,
          available_until: "2027-06-30T00:00:00.000Z",
          quality: JSON.stringify(l.quality),
          created_at: CREATED,
          updated_at: CREATED,
        })
        .onConflict("id")
        .ignore();
      for (const [i, w] of l.windows.entries()) {
        await trx("pickup_windows")
          .insert({ id: seedId(`${l.key}:window:${i}`), listing_id: id, kind: "weekly", weekday: w.weekday, start_time: w.start, end_time: w.end })
          .onConflict("id")
          .ignore();
      }
    }

    await trx("beds")
      .insert({
        id: seedId("bed:back-fence"),
        owner_id: seedId("user:gardener"),
        name: "Back fence bed",
        shape: JSON.stringify({ length_m: 3, width_m: 1.2 }),
        area_m2: 3.6,
        lat: TOWN.centre.lat + 0.004,
        lng: TOWN.centre.lng - 0.006,
        recipe: JSON.stringify({}),
        start_date: "2027-03-01",
        created_at: CREATED,
        updated_at: CREATED,
      })
      .onConflict("id")
      .ignore();
    await seedCommunity(trx);
    await seedPastPickups(trx);
    await seedNeeds(trx);
    await addPlaces(gazetteerEntries(), CREATED, trx);
    // The demo gardener plans from home when a bed has no place of its own.
    const home = gazetteerEntries().find((p) => p.name === "Orchard Rise")!;
    await trx("users").where({ id: seedId("user:gardener") }).whereNull("home_place").update({ home_place: `${home.name}, ${home.context}`, home_lat: home.lat, home_lng: home.lng });
  });

  const counts: Record<string, number> = {};
  for (const table of ["materials", "organisations", "users", "user_roles", "memberships", "listings", "pickup_windows", "beds", "reservations", "reviews", "needs", "places"]) {
    const [{ n }] = await knex(table).count({ n: "*" });
    counts[table] = Number(n);
  }
  return counts;
}
