import { randomBytes, scrypt as scryptCb, timingSafeEqual, type ScryptOptions } from "node:crypto";
import bcrypt from "bcryptjs";
import { readEnv } from "@/lib/env";

// Passwords are hashed with scrypt (Node's own crypto), which reads the whole password —
// bcrypt reads only its first 72 bytes — and is memory-hard. Hashes carry their parameters
// ("$scrypt$ln=15,r=8,p=3$salt$hash"), so older ones (bcrypt, or a lower cost) still verify
// and are replaced at the next successful sign-in (needsRehash). Parameters: N = 2^15, r = 8,
// p = 3, one of OWASP's Password Storage Cheat Sheet's scrypt settings (from memory).
// PASSWORD_HASH_COST (log2 N) lowers the cost for tests only.

const R = 8;
const P = 3;
const KEY_BYTES = 32;

function costLog2(): number {
  return readEnv().PASSWORD_HASH_COST ?? 15;
}

function scrypt(password: string, salt: Buffer, ln: number, r: number, p: number): Promise<Buffer> {
  const options: ScryptOptions = { N: 2 ** ln, r, p, maxmem: 256 * 2 ** ln * r + 16 * 1024 * 1024 };
  return new Promise((resolve, reject) => scryptCb(password.normalize("NFKC"), salt, KEY_BYTES, options, (err, key) => (err ? reject(err) : resolve(key))));
}

export async function hashPassword(plain: string): Promise<string> {
  const ln = costLog2();
  const salt = randomBytes(16);
  const key = await scrypt(plain, salt, ln, R, P);
  return `$scrypt$ln=${ln},r=${R},p=${P}$${salt.toString("base64")}$${key.toString("base64")}`;
}

const SCRYPT = /^\$scrypt\$ln=(\d+),r=(\d+),p=(\d+)\$([A-Za-z0-9+/=]+)\$([A-Za-z0-9+/=]+)$/;

async function verifyScrypt(plain: string, hash: string): Promise<boolean> {
  const m = SCRYPT.exec(hash);
  if (!m) return false;
  const [, ln, r, p, salt, want] = m;
  const expected = Buffer.from(want, "base64");
  const got = await scrypt(plain, Buffer.from(salt, "base64"), Number(ln), Number(r), Number(p));
  return got.length === expected.length && timingSafeEqual(got, expected);
}

// A hash at today's cost of a password nobody has, verified when the account is unknown or
// has no password, so every answer costs the same one scrypt.
let stand_in: Promise<string> | null = null;
let standInCost = 0;
function standInHash(): Promise<string> {
  if (!stand_in || standInCost !== costLog2()) {
    standInCost = costLog2();
    stand_in = hashPassword(randomBytes(24).toString("base64"));
  }
  return stand_in;
}

/** True when `plain` is the password behind `hash`. Unknown accounts (no hash) cost the same and answer false. */
export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  if (hash && hash.startsWith("$2")) return bcrypt.compare(plain, hash);
  if (hash && SCRYPT.test(hash)) return verifyScrypt(plain, hash);
  await verifyScrypt(plain, await standInHash());
  return false;
}

/** An older hash (bcrypt, or scrypt at another cost) to replace with today's after a successful sign-in. */
export function needsRehash(hash: string): boolean {
  const m = SCRYPT.exec(hash);
  return !m || Number(m[1]) !== costLog2() || Number(m[2]) !== R || Number(m[3]) !== P;
}
