import { WORM_TEMPERATURE_F } from "@/lib/calc/facts";
import { STAGES_OF, stageLabel, type OrderStage } from "@/lib/reservations/culture-orders";
import type { ReservationView } from "@/lib/reservations/view";
import { PALETTE } from "@/components/ui/palette";

// A live culture's way from the grower to the bed, with what matters for animals at each
// step: the posting day, the temperatures they travel in, and opening the box at once.
const fToC = (f: number) => Math.round(((f - 32) * 5) / 9);
const WINDOW = `${WORM_TEMPERATURE_F.comfortable_min}–${WORM_TEMPERATURE_F.comfortable_max} °F (${fToC(WORM_TEMPERATURE_F.comfortable_min)}–${fToC(WORM_TEMPERATURE_F.comfortable_max)} °C)`;

function careNote(stage: OrderStage, v: ReservationView): string {
  const posting = v.order?.posting;
  switch (stage) {
    case "paid":
      if (v.order?.fulfilment === "pickup") return "Agreed with the grower: fetch them at the time you arranged.";
      if (posting?.paused) return "Posting is paused for the weather; the grower sends it when it is safe.";
      return posting?.days.length ? `The grower posts on ${posting.days.join(" and ")}, so the box never waits in a depot over a weekend.` : "The grower posts early in the week, so the box never waits in a depot over a weekend.";
    case "packed":
      return "Boxed in damp bedding with air holes, enough for the journey.";
    case "shipped":
      return `Worms travel best at ${WINDOW}; they survive ${WORM_TEMPERATURE_F.survive_min}–${WORM_TEMPERATURE_F.survive_max} °F for a short while. Posting pauses in heatwaves and frost.`;
    case "delivered":
      return "Open the box within a day: loosen the bedding, mist it if dry, and let them settle in the shade before they go into the bed.";
    case "collected":
      return `Carry them home in the shade the same day, at ${WINDOW}, and open the tub when you get in.`;
  }
}

function StageMark({ stage, done }: { stage: OrderStage; done: boolean }) {
  const ink = done ? "#fff" : PALETTE.humus[700];
  return (
    <span aria-hidden="true" className={`flex h-9 w-9 shrink-0 items-center justify-center rounded-full ring-2 ${done ? "bg-moss-600 ring-moss-700" : "bg-white ring-humus-300"}`}>
      <svg viewBox="0 0 20 20" className="h-5 w-5" fill="none" stroke={ink} strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round">
        {stage === "paid" ? <path d="M4 10c2-4 10-4 12 0M6 13c2 2 6 2 8 0" /> : null}
        {stage === "packed" ? <path d="M3 7l7-3 7 3v7l-7 3-7-3zM3 7l7 3 7-3M10 10v7" /> : null}
        {stage === "shipped" ? <path d="M10 3v9M7 10a3 3 0 1 0 6 0M8 5h4M8 7h4" /> : null}
        {stage === "delivered" ? <path d="M3 9h14v7H3zM3 9l2-4h10l2 4M8 12c1 1 3 1 4 0" /> : null}
        {stage === "collected" ? <path d="M4 8h12l-1 8H5zM7 8a3 3 0 0 1 6 0" /> : null}
      </svg>
    </span>
  );
}

export function CultureJourney({ v }: { v: ReservationView }) {
  const order = v.order!;
  const stages = STAGES_OF[order.fulfilment];
  const current = order.stage ? stages.indexOf(order.stage) : -1;
  return (
    <ol aria-label="The culture's journey" className="flex flex-col">
      {stages.map((s, i) => {
        const done = i <= current;
        return (
          <li key={s} aria-current={i === current ? "step" : undefined} className="relative flex gap-3 pb-4 last:pb-0">
            {i < stages.length - 1 ? <span aria-hidden="true" className={`absolute left-[1.06rem] top-9 h-[calc(100%-2.25rem)] w-0.5 ${i < current ? "bg-moss-600" : "bg-humus-200"}`} /> : null}
            <StageMark stage={s} done={done} />
            <div className="flex flex-col">
              <span className={`font-semibold ${done ? "text-moss-800" : "text-humus-800"}`}>
                {stageLabel(s, v.amount_cents)}
                {done ? <span className="sr-only"> (done)</span> : null}
              </span>
              <span className="text-sm text-humus-700">{careNote(s, v)}</span>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
