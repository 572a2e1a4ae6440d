// npm run digest [-- --group <id>]: sends the weekly digest of stubborn cases and new verified fixes to each group's leads.
import path from "node:path";
import { openDatabase } from "../db/client";
import { sendAllDigests, sendDigest } from "../server/case-mail";
import { readEnv } from "../server/env";
import { mailerFromSettings } from "../server/mail-outbox";

async function main() {
  const env = readEnv();
  const at = process.argv.indexOf("--group");
  const groupId = at >= 0 ? process.argv[at + 1] : undefined;
  const handle = await openDatabase({ url: env.DATABASE_URL, dataDir: path.join(env.PHASEWISE_DATA_DIR, "db") });
  // Without SMTP_URL a one-off run has no outbox page to look at: write the messages to the console.
  const mailer = await mailerFromSettings({ smtpUrl: env.SMTP_URL, from: env.MAIL_FROM, production: true });
  const deps = { db: handle.db, mail: mailer.mail, baseURL: env.PUBLIC_URL ?? `http://localhost:${env.PORT}` };
  try {
    if (groupId) {
      const r = await sendDigest(deps, groupId);
      console.log(`digest for ${r.groupName}: ${r.stubborn.length} stubborn, ${r.verified.length} verified, sent to ${r.sent} lead(s)`);
    } else {
      const r = await sendAllDigests(deps);
      console.log(`digest: ${r.sent} message(s) for ${r.groups} group(s)`);
    }
  } finally {
    await mailer.close();
    await handle.close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
