import type { ListingCaution } from "@/lib/calc/cautions";
import { Notice } from "@/components/ui/notice";

/** A listing's cautions where a gardener decides to collect it: the listing page and an alert's page. */
export function ListingCautions({ cautions, title = "Before you collect" }: { cautions: ListingCaution[]; title?: string }) {
  return (
    <section aria-labelledby="care-title" className="flex flex-col gap-2">
      <h2 id="care-title" className="text-lg font-semibold">
        {title}
      </h2>
      <Notice tone="caution">
        <ul className="flex list-disc flex-col gap-1 pl-5">
          {cautions.map((c) => (
            <li key={c.kind} data-caution={c.kind}>
              {c.text}
            </li>
          ))}
        </ul>
      </Notice>
    </section>
  );
}
