// Starts the local Stripe fake for development: `npx tsx lib/fakes/stripe/cli.ts`.
import { startStripeFake } from "./server";
import { secret } from "@/lib/env";

async function main() {
  const port = Number(process.env.STRIPE_FAKE_PORT ?? 12111);
  const webhookUrl = process.env.STRIPE_WEBHOOK_URL ?? "http://127.0.0.1:3000/api/webhooks/stripe";
  const fake = await startStripeFake({
    port,
    webhookUrl,
    webhookSecret: secret("STRIPE_WEBHOOK_SECRET"),
    publicBaseUrl: process.env.STRIPE_FAKE_PUBLIC_URL,
    dataFile: process.env.STRIPE_FAKE_DATA || undefined,
    log: (line) => console.log(`[stripe-fake] ${line}`),
  });
  console.log(`[stripe-fake] listening on ${fake.url}, webhooks to ${webhookUrl}`);
  const stop = () => {
    void fake.close().then(() => process.exit(0));
  };
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
}

main().catch((err) => {
  console.error("[stripe-fake] failed to start:", err);
  process.exit(1);
});
