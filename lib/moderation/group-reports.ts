// Reports about the same listing or person read as one case: ten people reporting one listing
// are one thing for a moderator to judge, with ten voices in it, not ten rows.

export interface GroupableReport {
  id: string;
  listing_id: string | null;
  subject_user_id: string | null;
  created_at: string;
}

export interface ReportGroup<R extends GroupableReport> {
  /** "listing:<id>" or "user:<id>". */
  key: string;
  /** Oldest first; the first is the one actions cite. */
  reports: R[];
}

const keyOf = (r: GroupableReport) => (r.listing_id ? `listing:${r.listing_id}` : `user:${r.subject_user_id ?? r.id}`);

/** The reports grouped by what they are about, groups in the order of their oldest report. */
export function groupReports<R extends GroupableReport>(rows: readonly R[]): ReportGroup<R>[] {
  const groups = new Map<string, R[]>();
  for (const r of [...rows].sort((a, b) => a.created_at.localeCompare(b.created_at))) {
    const key = keyOf(r);
    const list = groups.get(key);
    if (list) list.push(r);
    else groups.set(key, [r]);
  }
  return [...groups].map(([key, reports]) => ({ key, reports }));
}
