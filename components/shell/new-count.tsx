/** How many new things wait behind a link (new alerts beside "My needs"), read out as "n new". */
export function NewCount({ n }: { n: number | undefined }) {
  if (!n) return null;
  return (
    <>
      <span aria-hidden="true" className="ml-1.5 rounded-full bg-ember-600 px-1.5 py-0.5 text-xs font-semibold text-white">
        {n}
      </span>
      <span className="sr-only">, {n} new</span>
    </>
  );
}
