import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { enqueueEmail } from "@/db/outbox";
import { findUserById, setPasswordHash } from "@/db/users";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { passwordProblem } from "@/lib/auth/password-strength";
import { endEverySession } from "@/lib/auth/sessions";
import { LIMITS, ensureUnder, forgive, recordFailure } from "@/lib/security/rate-limit";
import type { ChangePasswordInput } from "@/lib/validation/auth";
import { resolveContext, type Context } from "@/lib/context";

// A person's own account safety: a new password (which ends every session), "sign out
// everywhere", and the confirmation link sent again.


/**
 * Changes the password after checking the current one (wrong guesses count against the
 * account's sign-in limit, so a borrowed session cannot be used to guess it), then ends every
 * session of the account, this one included, and tells the owner by e-mail.
 */
export async function changePassword(userId: string, input: ChangePasswordInput, ctx: Context = {}): Promise<{ sessions_ended: number }> {
  const { db: q, clock } = resolveContext(ctx);
  const user = await findUserById(userId, q);
  if (!user) throw notFound("That account");
  const limits: [typeof LIMITS.signInAccount, string][] = [[LIMITS.signInAccount, user.email]];
  if (user.password_hash) {
    await ensureUnder(limits, clock, q);
    if (!(await verifyPassword(input.current_password, user.password_hash))) {
      await recordFailure(limits, clock, q);
      throw new ApiError("invalid_input", "Your current password did not match.", { current_password: "That is not your current password." });
    }
    await forgive(LIMITS.signInAccount, user.email, q);
  }
  const problem = passwordProblem(input.new_password, { email: user.email, name: user.display_name });
  if (problem) throw new ApiError("invalid_input", "Choose a stronger password.", { new_password: problem });
  const hash = await hashPassword(input.new_password);
  const ended = await writeTransaction(q, async (trx) => {
    await setPasswordHash(userId, hash, trx);
    await enqueueEmail({ to: user.email, template: "account.password_changed", data: { signInUrl: `${appUrl()}/sign-in` } }, trx);
    return endEverySession(userId, "password_changed", clock, trx);
  });
  return { sessions_ended: ended };
}

