import { renderEmail } from "../layout";

/** One listing that could serve one of the person's open needs, already worded for them. */
export interface AlertLine {
  /** "Fallen leaves" */
  material: string;
  listingTitle: string;
  supplier: string;
  /** "2.3 km" in the reader's units, to the listing's approximate point. */
  distance: string;
  /** "for Back fence bed" or "" for a need typed without a bed. */
  forWhat: string;
  /** "8 bags left" */
  left: string;
  /** "from 12 January 2027" when it cannot be reserved yet, else "". */
  from: string;
  url: string;
}

const describe = (a: AlertLine) =>
  `${a.listingTitle} from ${a.supplier}, about ${a.distance} away${a.forWhat ? ` ${a.forWhat}` : ""}: ${a.left}${a.from ? `, to reserve ${a.from}` : ""}.`;

/** At once, one listing: sent when the gardener chose immediate alerts. */
export function needAlertEmail(p: { name: string; line: AlertLine; cautions: string[]; needsUrl: string }) {
  const a = p.line;
  return renderEmail(`${a.material} listed near you${a.forWhat ? ` ${a.forWhat}` : ""}: ${a.listingTitle}`, {
    heading: `${a.material} you asked for is on offer`,
    paragraphs: [
      `Hello ${p.name}, something you are waiting for has been listed on Duffbank.`,
      describe(a),
      "One click reserves the amount your need still lacks, for the same bed; the supplier then accepts, and you get the pickup address.",
      ...(p.cautions.length ? [`Before you collect: ${p.cautions.join(" ")}`] : []),
      "You get one e-mail per listing and need. To get one a day instead, or to close the need, open your needs on Duffbank.",
    ],
    action: { label: "See it and reserve", url: a.url },
  });
}

/** At most once a day: every listing found for the person's open needs since the last one. */
export function needDigestEmail(p: { name: string; lines: AlertLine[]; needsUrl: string }) {
  const n = p.lines.length;
  return renderEmail(n === 1 ? `A listing for your open needs: ${p.lines[0].listingTitle}` : `${n} listings for your open needs`, {
    heading: n === 1 ? "Something you asked for is on offer" : `${n} things you asked for are on offer`,
    paragraphs: [
      `Hello ${p.name}, these were listed near you since we last wrote. Each link shows the listing, the cautions that go with it, and a button that reserves what your need still lacks.`,
    ],
    items: p.lines.map((a) => ({ text: `${a.material}: ${describe(a)}`, label: "See it and reserve", url: a.url })),
    action: { label: "All my needs", url: p.needsUrl },
    footer: "You get this at most once a day. Duffbank: spare leaves, straw, cardboard and worms, passed on to new beds.",
  });
}
