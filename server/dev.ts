// npm run dev: Express owns /api and proxies everything else (with websockets) to Metro's dev server.
import { spawn } from "node:child_process";
import path from "node:path";
import { createProxyMiddleware } from "http-proxy-middleware";
import { openDatabase } from "../db/client";
import { isEmpty, seedDemo } from "../db/seed";
import { createApp } from "./app";
import { readEnv } from "./env";
import { mailerFromSettings } from "./mail-outbox";

const METRO_PORT = 8081;

async function main() {
  const env = readEnv();
  const handle = await openDatabase({ url: env.DATABASE_URL, dataDir: path.join(env.PHASEWISE_DATA_DIR, "db") });
  const baseURL = env.PUBLIC_URL ?? `http://localhost:${env.PORT}`;
  const mailer = await mailerFromSettings({ smtpUrl: env.SMTP_URL, from: env.MAIL_FROM, production: false, outboxPort: env.PHASEWISE_OUTBOX_PORT });
  console.log(mailer.describe);
  const { app, auth } = createApp({
    db: handle.db,
    dbKind: handle.kind,
    mail: mailer.mail,
    baseURL,
    trustedOrigins: [`http://127.0.0.1:${env.PORT}`],
    dataDir: env.PHASEWISE_DATA_DIR,
  });
  if (env.PHASEWISE_DEMO !== "0" && (await isEmpty(handle.db))) await seedDemo(handle.db, auth);
  const metro = spawn("npx", ["expo", "start", "--web", "--port", String(METRO_PORT)], {
    stdio: "inherit",
    env: { ...process.env, EXPO_OFFLINE: "1", BROWSER: "none" },
  });
  const proxy = createProxyMiddleware({ target: `http://127.0.0.1:${METRO_PORT}`, changeOrigin: true, ws: true });
  // createApp ends /api with its own 404; everything else goes to Metro.
  app.use((req, res, next) => (req.path.startsWith("/api/") ? next() : proxy(req, res, next)));
  const server = app.listen(env.PORT, () => console.log(`Phasewise dev on ${baseURL} (Metro on ${METRO_PORT})`));
  server.on("upgrade", proxy.upgrade);
  const stop = async () => {
    metro.kill("SIGTERM");
    server.close();
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
