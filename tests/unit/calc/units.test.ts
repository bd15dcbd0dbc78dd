import { describe, expect, it } from "vitest";
import {
  cmToIn,
  ft2ToM2,
  ft3ToM3,
  ftToM,
  inToCm,
  kgToLb,
  kmToMi,
  lbToKg,
  miToKm,
  lToUsGal,
  m2ToFt2,
  m3ToFt3,
  m3ToUsGal,
  m3ToYd3,
  mToFt,
  usGalToL,
  yd3ToM3,
} from "@/lib/calc/units";

describe("conversions against NIST HB44 Appendix C", () => {
  it("1 US gal = 3.785411784 L exactly", () => {
    expect(usGalToL(1)).toBeCloseTo(3.785411784, 12);
    expect(lToUsGal(3.785411784)).toBeCloseTo(1, 12);
  });

  it("1 ft³ = 7.480519 US gal", () => {
    expect(m3ToUsGal(ft2ToM2(1) * ftToM(1))).toBeCloseTo(7.480519, 6);
  });

  it("1 yd³ = 27 ft³ = 201.974 US gal", () => {
    expect(m3ToUsGal(yd3ToM3(1))).toBeCloseTo(201.974, 3);
    expect(m3ToFt3(yd3ToM3(1))).toBeCloseTo(27, 10);
  });

  it("1 in of water on 1 ft² = 0.623377 US gal", () => {
    expect(m3ToUsGal(ft2ToM2(1) * (inToCm(1) / 100))).toBeCloseTo(0.623377, 6);
  });

  it("an acre-inch is 27,154 US gal (University of Georgia Extension)", () => {
    // An acre is 43,560 ft² (NIST HB44).
    const acreInchM3 = ft2ToM2(43_560) * (inToCm(1) / 100);
    expect(Math.round(m3ToUsGal(acreInchM3))).toBe(27_154);
  });

  it("the length, area, mass and volume factors follow from inch = 2.54 cm and lb = 0.45359237 kg", () => {
    expect(mToFt(0.3048)).toBeCloseTo(1, 12);
    expect(m2ToFt2(1)).toBeCloseTo(10.7639104, 6);
    expect(cmToIn(2.54)).toBeCloseTo(1, 12);
    expect(kgToLb(0.45359237)).toBeCloseTo(1, 12);
    expect(lbToKg(51)).toBeCloseTo(23.133, 3); // NIOSH 51 lb
    expect(kmToMi(1.609344)).toBeCloseTo(1, 12); // NIST HB44: 1 mile = 5,280 ft = 1,609.344 m
    expect(miToKm(5)).toBeCloseTo(8.04672, 12); // NIST HB44: 5 × 1,609.344 m
    expect(ft3ToM3(10)).toBeCloseTo(0.28316846592, 12); // NIST HB44: 1 ft = 0.3048 m, so 1 ft³ = 0.028316846592 m³
    expect(m3ToYd3(0.764554857984)).toBeCloseTo(1, 12);
  });

  it("round trips", () => {
    for (const x of [0.001, 1, 12.5, 9999]) {
      expect(ftToM(mToFt(x))).toBeCloseTo(x, 9);
      expect(inToCm(cmToIn(x))).toBeCloseTo(x, 9);
      expect(lbToKg(kgToLb(x))).toBeCloseTo(x, 9);
      expect(usGalToL(lToUsGal(x))).toBeCloseTo(x, 9);
      expect(yd3ToM3(m3ToYd3(x))).toBeCloseTo(x, 9);
    }
  });
});
