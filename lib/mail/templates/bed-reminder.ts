import { renderEmail } from "../layout";

export function bedReminderEmail(p: { name: string; bedName: string; title: string; detail?: string; date: string; url: string }) {
  return renderEmail(`${p.bedName}: ${p.title}`, {
    heading: p.title,
    paragraphs: [
      `Hello ${p.name}, today (${p.date}) is a step on the timeline of your bed "${p.bedName}".`,
      ...(p.detail ? [p.detail] : []),
      "You can turn these reminders off on your Duffbank profile.",
    ],
    action: { label: "Open the bed", url: p.url },
  });
}
