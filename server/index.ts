import path from "node:path";
import { openDatabase } from "../db/client";
import { isEmpty, seedDemo } from "../db/seed";
import { createApp } from "./app";
import { readEnv } from "./env";
import { createSmtpMailer, type Mailer } from "./mail";
import { createS3StorageFromSettings } from "./storage";

async function main() {
  const started = performance.now();
  const env = readEnv();
  const handle = await openDatabase({ url: env.DATABASE_URL, dataDir: path.join(env.PHASEWISE_DATA_DIR, "db") });
  const mail: Mailer = env.SMTP_URL
    ? createSmtpMailer(env.SMTP_URL, env.MAIL_FROM)
    : { send: async (m) => console.log(`[mail] to ${m.to}: ${m.subject}\n${m.text}`) };
  const baseURL = env.PUBLIC_URL ?? `http://localhost:${env.PORT}`;
  // Photos go to an S3-compatible bucket when one is named; otherwise createApp uses <dataDir>/photos.
  const storage = env.PHASEWISE_S3_BUCKET
    ? createS3StorageFromSettings({
        bucket: env.PHASEWISE_S3_BUCKET,
        endpoint: env.PHASEWISE_S3_ENDPOINT,
        region: env.PHASEWISE_S3_REGION,
        accessKey: env.PHASEWISE_S3_ACCESS_KEY,
        secretKey: env.PHASEWISE_S3_SECRET_KEY,
      })
    : undefined;
  const { app, auth } = createApp({
    db: handle.db,
    dbKind: handle.kind,
    mail,
    baseURL,
    secret: env.BETTER_AUTH_SECRET,
    trustedOrigins: [`http://127.0.0.1:${env.PORT}`, `http://localhost:${env.PORT}`],
    dataDir: env.PHASEWISE_DATA_DIR,
    webDir: env.PHASEWISE_WEB_DIR ?? path.join(__dirname, "..", "dist"),
    storage,
  });
  if (env.PHASEWISE_DEMO !== "0" && (await isEmpty(handle.db))) {
    await seedDemo(handle.db, auth);
    console.log("Seeded the demo group (accounts in the README).");
  }
  const server = app.listen(env.PORT, () => {
    console.log(`Phasewise ready on ${baseURL} (${handle.kind}) in ${Math.round(performance.now() - started)} ms`);
  });
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    server.close();
    server.closeAllConnections();
    await handle.close();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
