import Link from "next/link";
import type { StaffDayView } from "@/lib/giveaways/view";
import { longDate } from "@/lib/time/zoned";

/** A council's days with how full they are and the links staff need on the day. */
export function DaysTable({ days, caption }: { days: StaffDayView[]; caption: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="stack-table w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-humus-100">
          <tr>
            <th scope="col" className="p-2">Day</th>
            <th scope="col" className="p-2">Booked</th>
            <th scope="col" className="p-2">Status</th>
            <th scope="col" className="p-2">
              <span className="sr-only">Links</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {days.map((d) => {
            const booked = d.slots.reduce((n, s) => n + s.booked, 0);
            const capacity = d.slots.reduce((n, s) => n + s.capacity, 0);
            return (
              <tr key={d.id} className="border-t border-humus-100" data-day={d.id}>
                <td className="p-2">
                  <Link href={`/council/giveaways/${d.id}`} className="font-medium text-moss-800 underline underline-offset-4">
                    {d.title}
                  </Link>
                  <div className="text-humus-600">
                    {longDate(d.date)} · {d.material_name}
                  </div>
                </td>
                <td className="p-2" data-label="Booked">
                  {booked} of {capacity}
                </td>
                <td className="p-2" data-label="Status">{d.status === "cancelled" ? "Called off" : "Scheduled"}</td>
                <td className="p-2">
                  <span className="flex flex-wrap gap-3">
                    <Link href={`/council/giveaways/${d.id}/sheet`} className="text-moss-700 underline">
                      Sheet<span className="sr-only"> for {d.title}</span>
                    </Link>
                    <Link href={`/council/giveaways/${d.id}/check-in`} className="text-moss-700 underline">
                      Check in<span className="sr-only"> at {d.title}</span>
                    </Link>
                  </span>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
