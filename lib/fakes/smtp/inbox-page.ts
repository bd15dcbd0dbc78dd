import type { StoredMessage } from "./server";

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

const shell = (title: string, body: string) => `<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(title)}</title>
<style>body{font-family:system-ui,sans-serif;background:#f7f3ee;color:#271c13;margin:0;padding:24px;max-width:900px}
h1{font-size:20px}table{border-collapse:collapse;width:100%;background:#fff}td,th{padding:8px;border-bottom:1px solid #d9c6ad;text-align:left}
a{color:#40642e}.note{color:#6a4e31}pre{white-space:pre-wrap;background:#fff;padding:12px;border:1px solid #d9c6ad}</style>
</head><body>${body}</body></html>`;

export function renderInbox(messages: StoredMessage[], to: string | null): string {
  const rows = messages
    .map(
      (m) =>
        `<tr><td>${esc(m.received_at.replace("T", " ").slice(0, 19))}</td><td>${esc(m.to.join(", "))}</td><td><a href="/messages/${m.id}">${esc(m.subject || "(no subject)")}</a></td></tr>`,
    )
    .join("");
  return shell(
    "Local mail — Duffbank",
    `<h1>Local mail catcher</h1><p class="note">Every e-mail the app sends in development lands here; nothing leaves this machine.${to ? ` Showing mail to ${esc(to)}.` : ""}</p>
${messages.length ? `<table><thead><tr><th>Received (UTC)</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>` : "<p>No mail yet.</p>"}
<p class="note">JSON for scripts: <a href="/messages.json">/messages.json</a> (filter with ?to=)</p>`,
  );
}

export function renderMessage(m: StoredMessage): string {
  return shell(
    m.subject,
    `<p><a href="/">← All mail</a></p><h1>${esc(m.subject)}</h1><p class="note">To ${esc(m.to.join(", "))} · from ${esc(m.from)}</p>
${m.html ? `<iframe title="Message" sandbox style="width:100%;height:480px;border:1px solid #d9c6ad;background:#fff" srcdoc="${esc(m.html)}"></iframe>` : ""}
<h2>Plain text</h2><pre>${esc(m.text)}</pre>`,
  );
}
