// Small numeric helpers shared by the calc modules.

// Floating-point division can land a hair above a whole number (3.0000000000000004) and a
// plain ceil would then ask for a sheet, bag or bale nobody needs.
const EPS = 1e-9;

/** Whole units needed to hold `x` units' worth: 0 for nothing, else rounded up. */
export function ceilWhole(x: number): number {
  return x <= 0 ? 0 : Math.ceil(x - EPS);
}

/** Rounded to `places` decimals for output; sums are always taken before rounding. */
export function roundTo(x: number, places: number): number {
  const f = 10 ** places;
  return Math.round(x * f) / f;
}

export function assertPositiveFinite(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive finite number, got ${value}`);
  }
}

export function assertNonNegativeFinite(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be a non-negative finite number, got ${value}`);
  }
}
