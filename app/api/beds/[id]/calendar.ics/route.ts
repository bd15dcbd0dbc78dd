import { withAuth } from "@/lib/api/handler";
import { notFound } from "@/lib/api/errors";
import { getBed } from "@/lib/services/beds/get-bed";
import { bedEstimate, toBedView } from "@/lib/beds/view";
import { bedCalendar } from "@/lib/beds/calendar";
import { appUrl } from "@/lib/env";

// GET /api/beds/:id/calendar.ics — the bed's timeline for a calendar app.
export const GET = withAuth<{ id: string }>(async ({ params, user }) => {
  const row = await getBed(params.id, user.id);
  if (!row) throw notFound("That bed");
  const bed = toBedView(row);
  const ics = bedCalendar(bed, bedEstimate(bed, new Date(), user.unit_system).timeline, appUrl());
  const filename = `${bed.name.replace(/[^a-z0-9]+/gi, "-").toLowerCase() || "bed"}.ics`;
  return new Response(ics, {
    headers: { "content-type": "text/calendar; charset=utf-8", "content-disposition": `attachment; filename="${filename}"` },
  });
}, ["gardener"]);
