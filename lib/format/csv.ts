// RFC 4180 CSV: fields with commas, quotes or line breaks are quoted, quotes doubled.
// A text field that starts like a formula is prefixed with ' so a spreadsheet shows it
// rather than running it (OWASP, "CSV Injection").
type Cell = string | number | boolean | null | undefined;

function cell(v: Cell): string {
  if (v === null || v === undefined) return "";
  let s = String(v);
  if (typeof v === "string" && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function toCsv(header: string[], rows: Cell[][]): string {
  return [header, ...rows].map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}

/** A CSV download response with a safe file name. */
export function csvResponse(csv: string, filename: string): Response {
  const safe = filename.replace(/[^a-z0-9._-]+/gi, "-").toLowerCase();
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${safe}"` } });
}
