import path from "node:path";
import { openDatabase } from "../db/client";
import { isEmpty, seedDemo } from "../db/seed";
import { createApp } from "./app";
import { readEnv } from "./env";
import { startDigestTimer } from "./case-mail";
import { mailerFromSettings } from "./mail-outbox";
import { createS3StorageFromSettings } from "./storage";

async function main() {
  const started = performance.now();
  const env = readEnv();
  const handle = await openDatabase({ url: env.DATABASE_URL, dataDir: path.join(env.PHASEWISE_DATA_DIR, "db") });
  const mailer = await mailerFromSettings({
    smtpUrl: env.SMTP_URL,
    from: env.MAIL_FROM,
    production: env.NODE_ENV === "production",
    outboxPort: env.PHASEWISE_OUTBOX_PORT,
  });
  const mail = mailer.mail;
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
  const { app, auth, deps } = createApp({
    db: handle.db,
    dbKind: handle.kind,
    mail,
    baseURL,
    secret: env.BETTER_AUTH_SECRET,
    trustedOrigins: [`http://127.0.0.1:${env.PORT}`, `http://localhost:${env.PORT}`],
    dataDir: env.PHASEWISE_DATA_DIR,
    rateLimit: { enabled: env.PHASEWISE_RATE_LIMIT !== "0" },
    webDir: env.PHASEWISE_WEB_DIR ?? path.join(__dirname, "..", "dist"),
    storage,
  });
  if (env.PHASEWISE_DEMO !== "0" && (await isEmpty(handle.db))) {
    await seedDemo(handle.db, auth);
    console.log("Seeded the demo group (accounts in the README).");
  }
  const stopDigest = env.PHASEWISE_DIGEST_HOURS ? startDigestTimer(deps, env.PHASEWISE_DIGEST_HOURS) : () => undefined;
  const server = app.listen(env.PORT, () => {
    console.log(`Phasewise ready on ${baseURL} (${handle.kind}) in ${Math.round(performance.now() - started)} ms; ${mailer.describe}`);
    if (env.PHASEWISE_DIGEST_HOURS) console.log(`Digest to leads every ${env.PHASEWISE_DIGEST_HOURS} h.`);
  });
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    server.close();
    server.closeAllConnections();
    stopDigest();
    await mailer.close();
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
