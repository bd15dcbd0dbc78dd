import bcrypt from "bcryptjs";

// Cost 12 in production; tests and the demo seed may lower it through the environment.
const COST = Number(process.env.BCRYPT_COST ?? 12);

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a fixed hash when the account has none, so timing does not reveal it.
  return bcrypt.compare(plain, hash ?? "$2b$12$CwTycUXWue0Thq9StjUM0uJ8.5lVw3Q5X9I8P3c5pZr9xQ5o3Q5pC");
}
