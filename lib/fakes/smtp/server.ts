import http from "node:http";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { renderInbox, renderMessage } from "./inbox-page";
import { listenOn } from "../listen";

// A local SMTP server that keeps every message it is given, and a small HTTP inbox to read
// them: an HTML page for people and JSON for tests. Messages live in memory for the life of
// the process; the outbox table in the app's database is what guarantees delivery.

export interface StoredMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  received_at: string;
}

export interface SmtpFake {
  smtpPort: number;
  httpPort: number;
  inboxUrl: string;
  messages: StoredMessage[];
  close(): Promise<void>;
}

export interface SmtpFakeOptions {
  smtpPort?: number;
  httpPort?: number;
  host?: string;
}

export async function startSmtpFake(opts: SmtpFakeOptions = {}): Promise<SmtpFake> {
  const host = opts.host ?? "127.0.0.1";
  const messages: StoredMessage[] = [];
  let seq = 0;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    banner: "Duffbank local mail catcher",
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          messages.push({
            id: String(++seq),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            to,
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : null,
            received_at: new Date().toISOString(),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(opts.smtpPort ?? 0, host, () => resolve());
  });
  const smtpPort = (smtp.server.address() as AddressInfo).port;

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", `http://${host}`);
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? messages.filter((m) => m.to.includes(to)) : messages;
    if (req.method === "DELETE" && url.pathname === "/messages") {
      messages.length = 0;
      res.writeHead(204).end();
      return;
    }
    if (req.method === "GET" && url.pathname === "/messages.json") {
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify({ messages: list }));
      return;
    }
    const one = url.pathname.match(/^\/messages\/(\d+)(\.json)?$/);
    if (req.method === "GET" && one) {
      const msg = messages.find((m) => m.id === one[1]);
      if (!msg) {
        res.writeHead(404, { "content-type": "text/plain" }).end("No such message");
        return;
      }
      if (one[2]) res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(msg));
      else res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(renderMessage(msg));
      return;
    }
    if (req.method === "GET" && url.pathname === "/") {
      res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(renderInbox([...list].reverse(), to ?? null));
      return;
    }
    res.writeHead(404, { "content-type": "text/plain" }).end("Not found");
  });
  const httpPort = await listenOn(web, opts.httpPort ?? 0, host);

  return {
    smtpPort,
    httpPort,
    inboxUrl: `http://${host}:${httpPort}`,
    messages,
    async close() {
      await new Promise<void>((r) => smtp.close(() => r()));
      await new Promise<void>((r) => web.close(() => r()));
    },
  };
}
