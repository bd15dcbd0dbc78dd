// A listing's quality declaration (herbicide history, roadside source, a culture's species and
// how it travels) is stored as JSON text on the row. This is the one place that reads it back,
// called only by the listing row mapper (db/listings.ts toListingRow); lint keeps it so.

/**
 * The declaration as an object; empty when there is none or when the stored text is not a
 * JSON object (a row saved before declarations existed, or damaged), so every reader falls
 * back to the material's general cautions rather than failing.
 */
export function parseQuality(text: string | null | undefined): Record<string, unknown> {
  if (!text) return {};
  try {
    const v: unknown = JSON.parse(text);
    return v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
  } catch {
    return {};
  }
}
