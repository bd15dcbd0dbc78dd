import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { enqueueEmail } from "@/db/outbox";
import { findUserByEmail, insertUser, normaliseEmail, setRole } from "@/db/users";
import { ApiError } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { hashPassword } from "@/lib/auth/password";
import { passwordProblem } from "@/lib/auth/password-strength";
import { signInLink } from "@/lib/auth/sign-in-link";
import type { SignUpInput } from "@/lib/validation/auth";
import { resolveContext, type Context } from "@/lib/context";

/** What joining answers, whoever the address belongs to. */
function checkInboxAnswer(email: string) {
  return {
    status: "check_email" as const,
    email: normaliseEmail(email),
    message: `Check your inbox: we sent a message to ${normaliseEmail(email)}. Follow the link in it to confirm your address and sign in.`,
  };
}

/**
 * Joining. The answer is the same whether or not the address already has an account, and
 * so is the work (one password hash, one e-mail written to the outbox): a new address gets a
 * gardener account and a link that confirms the address and signs in; a known one gets "you
 * already have an account" and nothing changes. A new account is a gardener; giving roles
 * are asked for on the profile.
 */
export async function signUp(input: SignUpInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const problem = passwordProblem(input.password, { email: input.email, name: input.display_name });
  if (problem) throw new ApiError("invalid_input", "Choose a stronger password.", { password: problem });
  const password_hash = await hashPassword(input.password);
  const email = normaliseEmail(input.email);
  // Reads, then writes: on SQLite the worker may commit in between, and the whole
  // transaction runs again (writeTransaction) rather than answering 500.
  await writeTransaction(q, async (trx) => {
    if (await findUserByEmail(email, trx)) {
      await enqueueEmail({ to: email, template: "account.already_joined", data: { signInUrl: `${appUrl()}/sign-in` } }, trx);
      return;
    }
    const user = await insertUser({ email, display_name: input.display_name, password_hash, unit_system: input.unit_system }, trx);
    await setRole(user.id, "gardener", "active", trx);
    // After confirming: where they were going (a path on this site only), else a welcome.
    const link = await signInLink(email, input.callbackUrl ? safeCallbackPath(input.callbackUrl) : "/profile?welcome=1", now, trx);
    await enqueueEmail({ to: email, template: "account.confirm", data: { name: input.display_name, url: link }, dedupe_key: `account-confirm:${user.id}` }, trx);
  });
  return checkInboxAnswer(email);
}
