// Starts every local fake the app talks to in development and in `npm start`.
// Ports come from the environment so tests and a second checkout can pick others.
import { startSmtpFake } from "./smtp/server";

async function main() {
  const smtp = await startSmtpFake({
    smtpPort: Number(process.env.SMTP_PORT ?? 12025),
    httpPort: Number(process.env.INBOX_PORT ?? 12026),
  });
  console.log(`[fakes] SMTP on 127.0.0.1:${smtp.smtpPort}, inbox at ${smtp.inboxUrl}`);

  const stop = async () => {
    await smtp.close();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  console.error("[fakes] failed to start", err);
  process.exit(1);
});
