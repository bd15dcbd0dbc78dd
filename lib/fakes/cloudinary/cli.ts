// Starts the local Cloudinary fake from the environment: `tsx lib/fakes/cloudinary/cli.ts`.
// Settings: CLOUDINARY_URL (key, secret, cloud name), CLOUDINARY_FAKE_PORT (default
// 12112, else the port in upload_prefix), CLOUDINARY_FAKE_DIR (default .fakes-data/cloudinary).

import path from "node:path";
import { parseFakeEnv } from "./config";
import { startCloudinaryFake } from "./server";

async function main(): Promise<void> {
  const config = parseFakeEnv(process.env);
  if (config.warning) console.warn(`[cloudinary-fake] ${config.warning}`);
  const fake = await startCloudinaryFake({
    port: config.port,
    cloudName: config.cloudName,
    apiKey: config.apiKey,
    apiSecret: config.apiSecret,
    dataDir: path.resolve(config.dataDir),
  });
  console.log(`[cloudinary-fake] listening on ${fake.url} (cloud "${config.cloudName}", data in ${fake.state.dataDir})`);
  console.log(
    `[cloudinary-fake] app env: CLOUDINARY_URL=cloudinary://${config.apiKey}:<secret>@${config.cloudName}?upload_prefix=${fake.url}`,
  );

  let closing = false;
  const stop = (signal: NodeJS.Signals) => {
    if (closing) return;
    closing = true;
    console.log(`[cloudinary-fake] ${signal}, closing`);
    fake.close().then(() => process.exit(0), () => process.exit(1));
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  console.error("[cloudinary-fake] failed to start:", err instanceof Error ? err.message : err);
  process.exit(1);
});
