import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { enqueueEmail } from "@/db/outbox";
import { findUserById } from "@/db/users";
import { ApiError, notFound } from "@/lib/api/errors";
import { signInLink } from "@/lib/auth/sign-in-link";
import { LIMITS, consume } from "@/lib/security/rate-limit";
import { resolveContext, type Context } from "@/lib/context";

/** Sends the confirmation link again (limited like sign-in links). */
export async function resendConfirmation(userId: string, ctx: Context = {}): Promise<{ status: "sent" }> {
  const { db: q, clock } = resolveContext(ctx);
  const user = await findUserById(userId, q);
  if (!user) throw notFound("That account");
  if (user.email_verified_at) throw new ApiError("invalid_state", "Your e-mail address is already confirmed.");
  await consume([[LIMITS.linkEmail, user.email]], clock, q);
  await writeTransaction(q, async (trx) => {
    const link = await signInLink(user.email, "/profile", clock(), trx);
    await enqueueEmail({ to: user.email, template: "account.confirm", data: { name: user.display_name, url: link } }, trx);
  });
  return { status: "sent" };
}
