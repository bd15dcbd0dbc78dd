import Link from "next/link";
import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { whatsWaiting } from "@/lib/services/accounts/get-whats-waiting";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { PageHeading } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "What is waiting" };

/** Where a signed-in person lands: what waits for them in each of their roles, most pressing first. */
export default async function SignedInHome() {
  const user = await pageUser("/home");
  const sections = await whatsWaiting(user);
  const waiting = sections.reduce((n, s) => n + s.count, 0);
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeading
        title={`Hello, ${user.name}`}
        lead={waiting === 0 ? "Nothing is waiting for you right now." : `${waiting} ${waiting === 1 ? "thing is" : "things are"} waiting for you.`}
      />
      {sections.length === 0 ? (
        <p>
          Start by <Link href="/plan" className="text-moss-700 underline underline-offset-2">planning a bed</Link> or{" "}
          <Link href="/browse" className="text-moss-700 underline underline-offset-2">browsing what is on offer</Link>.
        </p>
      ) : null}
      {sections.map((s) => (
        <Panel
          key={s.id}
          id={s.id}
          title={`${s.title} (${s.count})`}
          action={
            <Link href={s.more.href} className="text-sm text-moss-700 underline underline-offset-2">
              {s.more.label}
            </Link>
          }
        >
          {s.count === 0 ? (
            <p className="text-humus-700">{s.empty}</p>
          ) : (
            <ul className="flex flex-col gap-2">
              {s.items.map((item, i) => (
                <li key={`${item.href}-${i}`} className="flex flex-wrap items-baseline justify-between gap-x-3">
                  <Link href={item.href} className="font-medium text-moss-700 underline underline-offset-2">
                    {item.label}
                  </Link>
                  {item.when ? <span className="text-sm text-humus-700">{formatLocal(item.when)}</span> : null}
                </li>
              ))}
              {s.count > s.items.length ? <li className="text-sm text-humus-700">and {s.count - s.items.length} more</li> : null}
            </ul>
          )}
        </Panel>
      ))}
    </div>
  );
}
