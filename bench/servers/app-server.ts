import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "../../db/client";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";
import { listenForBench } from "./listen";

/** The real app on an in-memory database, on a loopback port; prints "READY <port>". */
async function main() {
  const handle = await openDatabase({ dataDir: "memory://" });
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "phasewise-bench-app-"));
  const { app } = createApp({ db: handle.db, dbKind: handle.kind, mail: createRecordingMailer(), baseURL: "http://127.0.0.1", quiet: true, dataDir });
  listenForBench(app, async () => {
    await handle.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });
}

void main();
