import "server-only";
import { db } from "@/db/index";
import { enqueueEmail } from "@/db/outbox";
import { findUserById } from "@/db/users";
import { ApiError, notFound } from "@/lib/api/errors";
import { signInLink } from "@/lib/auth/sign-in-link";
import { LIMITS, consume } from "@/lib/security/rate-limit";
import type { Clock } from "@/lib/time/clock";

/** Sends the confirmation link again (limited like sign-in links). */
export async function resendConfirmation(userId: string, clock: Clock = () => new Date()): Promise<{ status: "sent" }> {
  const user = await findUserById(userId);
  if (!user) throw notFound("That account");
  if (user.email_verified_at) throw new ApiError("invalid_state", "Your e-mail address is already confirmed.");
  await consume([[LIMITS.linkEmail, user.email]], clock);
  await db().transaction(async (trx) => {
    const link = await signInLink(user.email, "/profile", clock(), trx);
    await enqueueEmail({ to: user.email, template: "account.confirm", data: { name: user.display_name, url: link } }, trx);
  });
  return { status: "sent" };
}
