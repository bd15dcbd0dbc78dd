
/** Words to search for: letters and digits only, so nothing typed can act as query syntax. */
export function searchWords(q: string | undefined): string[] {
  return (q ?? "").normalize("NFKC").toLowerCase().match(/[\p{L}\p{N}]+/gu)?.slice(0, 8) ?? [];
}
