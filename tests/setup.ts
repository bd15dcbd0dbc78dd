// `server-only` throws outside a React Server Components bundle; tests run modules directly.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));
// Passwords are hashed at a lower scrypt cost in tests (lib/auth/password.ts); same code, faster.
process.env.PASSWORD_HASH_COST ??= "12";
