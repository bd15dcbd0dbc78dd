import type { Adapter, AdapterUser } from "next-auth/adapters";
import { writeTransaction } from "@/db/write-transaction";
import { db, nowIso } from "@/db/index";
import { findUserByEmail, findUserById, insertUser, setRole, updateUser } from "@/db/users";
import type { UserRow } from "@/db/types";

// Only what magic-link sign-in with JWT sessions needs: users and verification tokens.
// Sessions live in the JWT, so no session table; accounts are not linked (no OAuth).

function toAdapterUser(row: UserRow): AdapterUser {
  return {
    id: row.id,
    email: row.email,
    name: row.display_name,
    emailVerified: row.email_verified_at ? new Date(row.email_verified_at) : null,
  };
}

export function knexAdapter(): Adapter {
  return {
    async createUser(user: Omit<AdapterUser, "id">) {
      const row = await writeTransaction(db(), async (trx) => {
        const created = await insertUser(
          {
            email: user.email,
            display_name: user.name || user.email.split("@")[0],
            email_verified_at: user.emailVerified ? user.emailVerified.toISOString() : null,
          },
          trx,
        );
        await setRole(created.id, "gardener", "active", trx);
        return created;
      });
      return toAdapterUser(row);
    },
    async getUser(id) {
      const row = await findUserById(id);
      return row ? toAdapterUser(row) : null;
    },
    async getUserByEmail(email) {
      const row = await findUserByEmail(email);
      return row ? toAdapterUser(row) : null;
    },
    async getUserByAccount() {
      return null;
    },
    async updateUser(user) {
      if (user.emailVerified) await updateUser(user.id, { email_verified_at: user.emailVerified.toISOString() });
      const row = await findUserById(user.id);
      return toAdapterUser(row!);
    },
    async linkAccount() {
      return undefined;
    },
    async createVerificationToken(token) {
      await db()("verification_tokens").insert({
        identifier: token.identifier,
        token: token.token,
        expires: token.expires.toISOString(),
      });
      return token;
    },
    async useVerificationToken({ identifier, token }) {
      return writeTransaction(db(), async (trx) => {
        const row = await trx("verification_tokens").select("identifier", "token", "expires").where({ identifier, token }).first();
        if (!row) return null;
        await trx("verification_tokens").where({ identifier, token }).delete();
        // Spent and stale tokens are cleared as they are used.
        await trx("verification_tokens").where("expires", "<", nowIso()).delete();
        return { identifier: row.identifier, token: row.token, expires: new Date(row.expires) };
      });
    },
  };
}
