import "server-only";
import { db } from "@/db/index";
import { findUserByEmail, insertUser, setRole } from "@/db/users";
import { ApiError } from "@/lib/api/errors";
import { hashPassword } from "@/lib/auth/password";
import type { SignUpInput } from "@/lib/validation/auth";

/** A new account is a gardener; giving roles are asked for on the profile. */
export async function signUp(input: SignUpInput) {
  const password_hash = await hashPassword(input.password);
  return db().transaction(async (trx) => {
    if (await findUserByEmail(input.email, trx)) {
      throw new ApiError("conflict", "An account with that e-mail already exists. Sign in instead.", {
        email: "An account with that e-mail already exists.",
      });
    }
    const user = await insertUser({ email: input.email, display_name: input.display_name, password_hash, unit_system: input.unit_system }, trx);
    await setRole(user.id, "gardener", "active", trx);
    return { id: user.id, email: user.email, display_name: user.display_name, unit_system: user.unit_system, roles: ["gardener"] };
  });
}
