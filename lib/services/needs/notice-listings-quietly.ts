import "server-only";
import type { Context } from "@/lib/context";
import { noticeListingsFor, type NoticedNeed } from "@/lib/services/needs/notice-listings";

/** After a need was opened or changed: the notices, without failing the change that was already made. */
export async function noticeListingsQuietly(need: NoticedNeed, ctx: Context = {}): Promise<void> {
  try {
    await noticeListingsFor(need, ctx);
  } catch (err) {
    console.error(`[needs] listings on offer for need ${need.id} not shown:`, (err as Error).message);
  }
}
