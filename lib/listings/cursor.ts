// Browse cursors: the sort key of the last row a page showed, opaque to clients (base64url
// JSON) so the format can change without breaking anyone who treats it as a string.
import { ApiError } from "@/lib/api/errors";
import type { SearchCursor } from "@/db/listing-search";

export function encodeCursor(c: SearchCursor): string {
  const body = c.by === "distance" ? { b: "d", d: c.d, i: c.id } : { b: "n", t: c.t, i: c.id };
  return Buffer.from(JSON.stringify(body), "utf8").toString("base64url");
}

const bad = () => new ApiError("invalid_input", "That cursor is not one of ours. Start again from the first page.", { cursor: "Use next_cursor from the previous page, unchanged." });

/** Decodes a cursor for a search sorted `by`; one from another kind of search is refused. */
export function decodeCursor(text: string, by: SearchCursor["by"]): SearchCursor {
  let v: { b?: unknown; d?: unknown; t?: unknown; i?: unknown };
  try {
    v = JSON.parse(Buffer.from(text, "base64url").toString("utf8"));
  } catch {
    throw bad();
  }
  if (!v || typeof v !== "object" || typeof v.i !== "string" || v.i.length > 64) throw bad();
  if (by === "distance" && v.b === "d" && typeof v.d === "number" && Number.isFinite(v.d)) return { by, d: v.d, id: v.i };
  if (by === "newest" && v.b === "n" && typeof v.t === "string" && !Number.isNaN(Date.parse(v.t))) return { by, t: v.t, id: v.i };
  throw new ApiError("invalid_input", "That cursor belongs to a different search. Start again from the first page.", {
    cursor: "A cursor only works with the same kind of search (with or without a point).",
  });
}
