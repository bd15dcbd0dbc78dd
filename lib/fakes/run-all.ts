// Starts every local fake the app talks to in development, `npm start` and the e2e run:
// the SMTP catcher with its inbox, the Stripe-compatible API with its hosted payment page,
// the Cloudinary-compatible upload and delivery server, and the Photon-compatible geocoder. Ports come from the
// environment so tests and a second checkout can pick others.
import "../env-files";
import path from "node:path";
import { checkStartup, secret } from "@/lib/env";
import { startSmtpFake } from "./smtp/server";
import { startStripeFake } from "./stripe/server";
import { stripeDataFile } from "./stripe/state";
import { startCloudinaryFake } from "./cloudinary/server";
import { parseFakeEnv } from "./cloudinary/config";
import { startGeocoderFake } from "./geocoder/server";

async function main() {
  checkStartup("fakes");
  const appPort = Number(process.env.PORT ?? 3000);
  const smtp = await startSmtpFake({
    smtpPort: Number(process.env.SMTP_PORT ?? 12025),
    httpPort: Number(process.env.INBOX_PORT ?? 12026),
  });
  console.log(`[fakes] SMTP on 127.0.0.1:${smtp.smtpPort}, inbox at ${smtp.inboxUrl}`);

  const webhookUrl = process.env.STRIPE_WEBHOOK_URL ?? `http://127.0.0.1:${appPort}/api/webhooks/stripe`;
  const stripe = await startStripeFake({
    port: Number(process.env.STRIPE_FAKE_PORT ?? 12111),
    webhookUrl,
    webhookSecret: secret("STRIPE_WEBHOOK_SECRET"),
    publicBaseUrl: process.env.STRIPE_FAKE_PUBLIC_URL,
    // Kept across restarts, beside the database whose rows name its records.
    dataFile: stripeDataFile(),
    log: (line) => console.log(`[stripe-fake] ${line}`),
  });
  console.log(`[fakes] Stripe API at ${stripe.url}, webhooks to ${webhookUrl}, records in ${stripeDataFile()}`);

  const photos = parseFakeEnv(process.env);
  const cloudinary = await startCloudinaryFake({
    port: photos.port,
    cloudName: photos.cloudName,
    apiKey: photos.apiKey,
    apiSecret: photos.apiSecret,
    dataDir: path.resolve(photos.dataDir),
  });
  console.log(`[fakes] Cloudinary at ${cloudinary.url} (cloud "${photos.cloudName}")`);

  const geocoder = await startGeocoderFake({ port: Number(process.env.GEOCODER_FAKE_PORT ?? 12113) });
  console.log(`[fakes] geocoder (Photon API) at ${geocoder.url}; the app asks it when GEOCODER_URL points there`);

  let closing = false;
  const stop = async () => {
    if (closing) return;
    closing = true;
    await Promise.allSettled([smtp.close(), stripe.close(), cloudinary.close(), geocoder.close()]);
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  console.error("[fakes] failed to start", err);
  process.exit(1);
});
