// Every e-mail is sent as HTML and plain text from the same parts.

export interface EmailParts {
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Several things to open (a digest): each a line of text and a link of its own. */
  items?: { text: string; label: string; url: string }[];
  footer?: string;
}

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

export function renderEmail(subject: string, parts: EmailParts): { subject: string; text: string; html: string } {
  const footer = parts.footer ?? "Duffbank: spare leaves, straw, cardboard and worms, passed on to new beds.";
  const text = [
    parts.heading,
    "",
    ...parts.paragraphs.flatMap((p) => [p, ""]),
    ...(parts.items ?? []).flatMap((i) => [`- ${i.text}`, `  ${i.label}: ${i.url}`, ""]),
    ...(parts.action ? [`${parts.action.label}: ${parts.action.url}`, ""] : []),
    "--",
    footer,
  ].join("\n");
  const html = `<!doctype html><html><body style="margin:0;background:#f7f3ee;font-family:'Work Sans',Arial,sans-serif;color:#271c13">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="font-weight:700;color:#40642e;margin:0 0 16px">Duffbank</p>
<h1 style="font-size:20px;margin:0 0 12px">${escape(parts.heading)}</h1>
${parts.paragraphs.map((p) => `<p style="line-height:1.5">${escape(p)}</p>`).join("\n")}
${parts.items?.length ? `<ul style="padding-left:20px">${parts.items.map((i) => `<li style="line-height:1.5;margin-bottom:8px">${escape(i.text)} <a href="${escape(i.url)}" style="color:#40642e">${escape(i.label)}</a></li>`).join("")}</ul>` : ""}
${parts.action ? `<p><a href="${escape(parts.action.url)}" style="display:inline-block;background:#40642e;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${escape(parts.action.label)}</a></p>` : ""}
<p style="color:#6a4e31;font-size:13px;margin-top:24px">${escape(footer)}</p>
</div></body></html>`;
  return { subject, text, html };
}
