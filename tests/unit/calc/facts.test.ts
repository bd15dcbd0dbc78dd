import { describe, expect, it } from "vitest";
import {
  BAG_M3,
  BALE_EXPANSION_FACTOR,
  BALE_KG,
  BALE_M3,
  CN_RATIO,
  FOOT_M,
  MATERIAL_CODES,
  MATERIALS,
  MOISTURE_PCT,
  NIOSH_LIFT_LIMIT_KG,
  NIOSH_LIFT_LIMIT_LB,
  POUND_KG,
  US_GALLON_M3,
  WORMS_PER_KG,
} from "@/lib/calc/facts";

describe("MATERIALS — composition", () => {
  // NRAES-54 (On-Farm Composting Handbook, 1992), Appendix A, Table A.1: [%N dry, C:N, moisture % wet].
  const tableA1: [keyof typeof MATERIALS, number | null, number, number][] = [
    ["cardboard", 0.1, 563, 8], // corrugated cardboard
    ["leaves", 0.9, 54, 38],
    ["straw", 0.7, 80, 12], // straw, general
    ["grass_clippings", 3.4, 17, 82],
    ["manure", 1.6, 30, 72], // horse manure
  ];
  it.each(tableA1)("%s matches NRAES-54 Table A.1", (code, n, cn, moisture) => {
    expect(MATERIALS[code].n_pct).toBe(n);
    expect(MATERIALS[code].cn_ratio).toBe(cn);
    expect(MATERIALS[code].moisture_pct).toBe(moisture);
  });

  it("coffee grounds sit inside NRAES-54 Table A.1's figures (about 2.3 %N, C:N 20, 75–80 % moisture)", () => {
    const c = MATERIALS.coffee_grounds;
    expect(c.n_pct).toBeCloseTo(2.3, 5);
    expect(c.cn_ratio).toBe(20);
    expect(c.moisture_pct).toBeGreaterThanOrEqual(75);
    expect(c.moisture_pct).toBeLessThanOrEqual(80);
  });

  it("wood chips carry the hardwood C:N of NRAES-54 Table A.1 (560)", () => {
    expect(MATERIALS.wood_chips.cn_ratio).toBe(560);
  });

  it("every material is in the table under its own code, with a named source", () => {
    expect([...MATERIAL_CODES].sort()).toEqual(Object.keys(MATERIALS).sort());
    for (const code of MATERIAL_CODES) {
      const m = MATERIALS[code];
      expect(m.code).toBe(code);
      expect(m.source.length).toBeGreaterThan(10);
      expect(Number.isFinite(m.bulk_density_kg_m3) && m.bulk_density_kg_m3 > 0).toBe(true);
      expect(m.moisture_pct).toBeGreaterThanOrEqual(0);
      expect(m.moisture_pct).toBeLessThan(100);
    }
  });
});

describe("MATERIALS — bulk density", () => {
  // Missouri S&T compost-mixture table, lb per US gallon. Converted here by hand with
  // NIST HB44 factors: 1 lb/gal = 0.45359237 kg / 0.003785411784 m³ = 119.826427 kg/m³.
  const lbPerGal: [keyof typeof MATERIALS, number][] = [
    ["cardboard", 0.5],
    ["leaves", 1], // loose, dry
    ["grass_clippings", 1.7], // loose
    ["coffee_grounds", 7],
    ["manure", 6.8], // horse manure
  ];
  it.each(lbPerGal)("%s matches Missouri S&T %s lb/US gal", (code, lb) => {
    expect(MATERIALS[code].bulk_density_kg_m3).toBeCloseTo(lb * 119.826427, 3);
  });

  it("cardboard agrees with US EPA ORCR (2016), 106 lb/yd³ = 62.9 kg/m³, within 10 %", () => {
    // 106 lb/yd³ × 0.593276 kg/m³ per lb/yd³ (NIST HB44) = 62.887 kg/m³
    expect(Math.abs(MATERIALS.cardboard.bulk_density_kg_m3 - 62.887) / 62.887).toBeLessThan(0.1);
  });

  it("green wood chips match Oregon DEQ (2005), 473 lb/yd³", () => {
    expect(MATERIALS.wood_chips.bulk_density_kg_m3).toBeCloseTo(473 * 0.593276, 1);
  });

  it("finished compost lies in 1,000–1,600 lb/yd³ (common practice)", () => {
    const lbPerYd3 = MATERIALS.compost.bulk_density_kg_m3 / 0.593276;
    expect(lbPerYd3).toBeGreaterThanOrEqual(1000);
    expect(lbPerYd3).toBeLessThanOrEqual(1600);
  });

  // Straw's three common-practice ranges must agree with each other: a small bale weighs
  // 40–60 lb; baled straw is 7–12 lb/ft³ and loose straw 1–3 lb/ft³ (biomass handling
  // texts). 1 lb/ft³ = 16.018463 kg/m³ (NIST HB44).
  it("the default bale weighs what a small bale weighs, 40–60 lb, 18–27 kg (common practice)", () => {
    const lb = BALE_KG / 0.45359237;
    expect(lb).toBeGreaterThanOrEqual(40);
    expect(lb).toBeLessThanOrEqual(60);
    // The caution quotes the range in whole kilograms: 40 lb = 18.1, 60 lb = 27.2.
    expect(BALE_KG).toBeGreaterThanOrEqual(18);
    expect(BALE_KG).toBeLessThanOrEqual(27);
  });

  it("in the bale that is baled straw, 7–12 lb/ft³ (common practice)", () => {
    const lbFt3 = BALE_KG / 0.45359237 / 5.25;
    expect(lbFt3).toBeGreaterThanOrEqual(7);
    expect(lbFt3).toBeLessThanOrEqual(12);
  });

  it("spread straw is loose straw, 1–3 lb/ft³ (common practice), and only straw expands from the bale", () => {
    const spread = MATERIALS.straw.bulk_density_kg_m3 / 16.018463;
    expect(spread).toBeGreaterThanOrEqual(1);
    expect(spread).toBeLessThanOrEqual(3);
    expect(MATERIALS.straw.bale_expansion).toBe(BALE_EXPANSION_FACTOR);
    for (const code of MATERIAL_CODES.filter((c) => c !== "straw")) expect(MATERIALS[code].bale_expansion).toBeUndefined();
  });
});

describe("units and unit sizes", () => {
  it("uses the NIST HB44 definitions", () => {
    expect(FOOT_M).toBeCloseTo(0.3048, 12); // 12 × 0.0254 m
    expect(US_GALLON_M3).toBeCloseTo(0.003785411784, 15); // 231 in³
    expect(POUND_KG).toBe(0.45359237);
  });

  it("a two-string bale of 14 × 18 × 36 in is 5.25 ft³ (derived; size common practice)", () => {
    expect(BALE_M3 / FOOT_M ** 3).toBeCloseTo(5.25, 10);
  });

  it("a 30-gallon lawn-and-leaf bag is 4.01 ft³ (derived; size common practice)", () => {
    expect(BAG_M3 / FOOT_M ** 3).toBeCloseTo(4.01, 2);
  });

  it("about 1,000 worms per pound is about 2,205 per kg (common practice)", () => {
    expect(WORMS_PER_KG).toBeCloseTo(2204.6, 1);
  });

  it("NIOSH's recommended weight limit is 51 lb, 23 kg", () => {
    expect(NIOSH_LIFT_LIMIT_LB).toBe(51);
    expect(NIOSH_LIFT_LIMIT_KG).toBe(23);
    expect(NIOSH_LIFT_LIMIT_LB * 0.45359237).toBeCloseTo(NIOSH_LIFT_LIMIT_KG, 0);
  });
});

describe("targets", () => {
  it("moisture: 50–60 % ideal, 40–65 % acceptable (The Composting Handbook, 2022, Table 4.2)", () => {
    expect([MOISTURE_PCT.ideal_min, MOISTURE_PCT.ideal_max, MOISTURE_PCT.min, MOISTURE_PCT.max]).toEqual([50, 60, 40, 65]);
    expect(MOISTURE_PCT.target).toBe(55);
  });

  it("squeeze test — a few drops, no steady drip — is 50–60 % (Cornell, Composting in the Classroom; common practice)", () => {
    expect(MOISTURE_PCT.target).toBeGreaterThanOrEqual(50);
    expect(MOISTURE_PCT.target).toBeLessThanOrEqual(60);
  });

  it("C:N 25–40 ideal (The Composting Handbook, 2022, Table 4.2)", () => {
    expect([CN_RATIO.ideal_min, CN_RATIO.ideal_max]).toEqual([25, 40]);
  });
});
