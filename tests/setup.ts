// `server-only` throws outside a React Server Components bundle; tests run modules directly.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));
