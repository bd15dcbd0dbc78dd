// How place names are searched: by prefix, of the whole name or any word in it, with or
// without the town after it, case, accents and punctuation aside. Pure: the gazetteer
// repository, the local geocoding fake and the tests share it.

/** "Tanner's Walk" → "tanners walk"; "FH1 2BT" → "fh1 2bt". */
export function normalizePlaceText(text: string): string {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/['’`]/g, "")
    .replace(/[^a-z0-9]+/g, " ")
    .trim();
}

/**
 * The strings a place can be found by the start of: its name from each word on, the name
 * with its town after it ("mill leat lane fernhollow"), and a postcode without its space.
 */
export function placeTerms(p: { name: string; context: string | null; kind: string }): string[] {
  const name = normalizePlaceText(p.name);
  const words = name.split(" ");
  const terms = new Set<string>();
  for (let i = 0; i < words.length; i++) terms.add(words.slice(i).join(" "));
  if (p.context) terms.add(`${name} ${normalizePlaceText(p.context)}`);
  if (p.kind === "postcode") terms.add(name.replace(/ /g, ""));
  return [...terms].filter((t) => t.length > 0);
}

/** Whether a place matches what was typed (the same rule as the database's prefix search). */
export function placeMatches(p: { name: string; context: string | null; kind: string }, query: string): boolean {
  const q = normalizePlaceText(query);
  if (!q) return false;
  return placeTerms(p).some((t) => t.startsWith(q) || t.startsWith(q.replace(/ /g, "")));
}

const KIND_RANK: Record<string, number> = { town: 0, village: 1, postcode: 2, street: 3, landmark: 4 };

/** Best first: a name that is exactly what was typed, then towns and villages, postcodes, streets, the rest; then by name. */
export function comparePlaces(query: string) {
  const q = normalizePlaceText(query);
  return (a: { name: string; kind: string }, b: { name: string; kind: string }) => {
    const exact = Number(normalizePlaceText(b.name) === q) - Number(normalizePlaceText(a.name) === q);
    if (exact) return exact;
    const rank = (KIND_RANK[a.kind] ?? 9) - (KIND_RANK[b.kind] ?? 9);
    return rank || a.name.localeCompare(b.name, "en");
  };
}

/** "Mill Leat Lane, Fernhollow": what a person reads for a place. */
export const placeLabel = (p: { name: string; context: string | null }) => (p.context && p.context !== p.name ? `${p.name}, ${p.context}` : p.name);
