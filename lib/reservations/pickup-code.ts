import { randomInt, timingSafeEqual } from "node:crypto";

// Six characters from an alphabet without look-alikes (no 0/O, 1/I/L), read out at the
// gate or typed on a phone: about 10⁹ codes, plenty for one pickup.
const ALPHABET = "ABCDEFGHJKMNPQRSTUVWXYZ23456789";
export const PICKUP_CODE_LENGTH = 6;

export function newPickupCode(): string {
  let code = "";
  for (let i = 0; i < PICKUP_CODE_LENGTH; i++) code += ALPHABET[randomInt(ALPHABET.length)];
  return code;
}

/** Spaces, dashes and case do not matter when the supplier types it in. */
export function normalisePickupCode(input: string): string {
  return input.toUpperCase().replace(/[^A-Z0-9]/g, "");
}

export function pickupCodeMatches(expected: string, typed: string): boolean {
  const a = Buffer.from(normalisePickupCode(expected));
  const b = Buffer.from(normalisePickupCode(typed));
  return a.length === b.length && timingSafeEqual(a, b);
}
