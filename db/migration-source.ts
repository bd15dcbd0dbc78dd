import type { Knex } from "knex";
import * as core from "../migrations/20261201_001_core";
import * as reviews from "../migrations/20261201_002_reviews";
import * as listingSearch from "../migrations/20261201_003_listing_search";
import * as listingUnitPrice from "../migrations/20261201_004_listing_unit_price";
import * as reservations from "../migrations/20261201_005_reservations";
import * as community from "../migrations/20261201_006_community";
import * as placeKeyedOffsets from "../migrations/20261202_008_place_keyed_offsets";
import * as cultureOrders from "../migrations/20261203_009_culture_orders";
import * as giveawayDeposits from "../migrations/20261204_010_giveaway_deposits";
import * as outboxClaims from "../migrations/20261205_011_outbox_claims";
import * as sessionsAndLimits from "../migrations/20261206_012_sessions_and_limits";
import * as operations from "../migrations/20261207_013_operations";
import * as exactQuantities from "../migrations/20261207_014_exact_quantities";
import * as spatialIndex from "../migrations/20261207_015_spatial_index";
import * as listingPoints from "../migrations/20261208_016_listing_points";
import * as openNeeds from "../migrations/20261208_020_open_needs";
import * as answerWindows from "../migrations/20261209_030_answer_windows";
import * as places from "../migrations/20261209_031_places";
import * as culturePacks from "../migrations/20261210_032_culture_packs";
import * as outboxTemplateData from "../migrations/20261211_033_outbox_template_data";

// Migrations are listed here rather than found on disk so that the same list runs under
// the CLI script, Vitest and the bundled Next.js server alike. Add new ones at the end.
const migrations: Record<string, Knex.Migration> = {
  "20261201_001_core": core,
  "20261201_002_reviews": reviews,
  "20261201_003_listing_search": listingSearch,
  "20261201_004_listing_unit_price": listingUnitPrice,
  "20261201_005_reservations": reservations,
  "20261201_006_community": community,
  "20261202_008_place_keyed_offsets": placeKeyedOffsets,
  "20261203_009_culture_orders": cultureOrders,
  "20261204_010_giveaway_deposits": giveawayDeposits,
  "20261205_011_outbox_claims": outboxClaims,
  "20261206_012_sessions_and_limits": sessionsAndLimits,
  "20261207_013_operations": operations,
  "20261207_014_exact_quantities": exactQuantities,
  "20261207_015_spatial_index": spatialIndex,
  "20261208_016_listing_points": listingPoints,
  "20261208_020_open_needs": openNeeds,
  "20261209_030_answer_windows": answerWindows,
  "20261209_031_places": places,
  "20261210_032_culture_packs": culturePacks,
  "20261211_033_outbox_template_data": outboxTemplateData,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
