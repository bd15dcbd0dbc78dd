import { createHash } from "node:crypto";
import type { InviteRow } from "@/db/types";

/** An invitation link works for a week (common practice, no source). */
export const INVITE_TTL_DAYS = 7;

export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export interface InviteView {
  id: string;
  email: string;
  status: InviteRow["status"];
  expires_at: string;
  created_at: string;
}
export const inviteView = (r: InviteRow): InviteView => ({ id: r.id, email: r.email, status: r.status, expires_at: r.expires_at, created_at: r.created_at });

