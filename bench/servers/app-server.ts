import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import { openDatabase } from "../../db/client";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";

/** The real app on an in-memory database, on a loopback port; prints "READY <port>". */
async function main() {
  const handle = await openDatabase({ dataDir: "memory://" });
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "phasewise-bench-app-"));
  const { app } = createApp({ db: handle.db, dbKind: handle.kind, mail: createRecordingMailer(), baseURL: "http://127.0.0.1", quiet: true, dataDir });
  const server = app.listen(0, "127.0.0.1", () => {
    process.stdout.write(`READY ${(server.address() as AddressInfo).port}\n`);
  });
  process.on("SIGTERM", () => {
    server.close();
    server.closeAllConnections();
    void handle.close().finally(() => {
      fs.rmSync(dataDir, { recursive: true, force: true });
      process.exit(0);
    });
  });
}

void main();
