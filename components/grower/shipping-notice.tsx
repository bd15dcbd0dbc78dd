import type { ShippingView } from "@/lib/growers/view";

/** What a buyer reads on a grower's worm listing: posting days, or that posting is paused for the weather. */
export function ShippingNotice({ shipping }: { shipping: ShippingView }) {
  return (
    <p role="status" className={`rounded-lg border-l-4 p-3 text-sm ${shipping.paused ? "border-ember-600 bg-ember-100 text-ember-800" : "border-moss-300 bg-moss-50 text-moss-900"}`}>
      {shipping.notice}
    </p>
  );
}
