import { renderEmail } from "../layout";

export function reportOutcomeEmail(p: { name: string; subject: string; reason: string; outcome: string; actions: string[] }) {
  return renderEmail(`Your report about ${p.subject}: outcome`, {
    heading: "We looked into your report",
    paragraphs: [
      `Hello ${p.name}, thank you for reporting ${p.subject} (${p.reason}). A Duffbank moderator has closed the report.`,
      ...(p.actions.length ? [`What we did: ${p.actions.join("; ")}.`] : []),
      `The moderator's note: ${p.outcome}`,
      "Reports help keep the material passed on here clean and as described.",
    ],
  });
}
