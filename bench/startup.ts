import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { openDatabase } from "../db/client";
import { demoGroupId } from "../db/seed";
import { user } from "../db/schema";
import { ROOT, startChild } from "./child";
import { insertGeneratedCases } from "./seed-cases";

export interface StartupFigure {
  label: string;
  /** spawn to the server's "ready" line, as seen from outside */
  readyMs: number;
  /** the server's own figure: database open, migrations, demo seed, listen */
  serverMs: number | null;
  maxRssMb: number | null;
  /** readyMs ÷ the bare Express child's readyMs */
  ratio: number;
}

export interface StartupReport {
  bare: { readyMs: number; maxRssMb: number | null };
  runs: StartupFigure[];
}

async function freePort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, "127.0.0.1", r));
  const port = (srv.address() as net.AddressInfo).port;
  await new Promise((r) => srv.close(r));
  return port;
}

async function startServer(dataDir: string) {
  const port = await freePort();
  const { child, match, readyMs } = await startChild(path.join(ROOT, "server/index.ts"), {
    env: { PHASEWISE_DATA_DIR: dataDir, PORT: String(port), PHASEWISE_DEMO: "1", PHASEWISE_WEB_DIR: path.join(dataDir, "no-web") },
    ready: /Phasewise ready on \S+ \(\w+\) in (\d+) ms/,
    reportRss: true,
    timeoutMs: 180_000,
  });
  const { maxRssKb } = await child.stop();
  return { readyMs, serverMs: Number(match[1]), maxRssMb: maxRssKb === null ? null : maxRssKb / 1024 };
}

/**
 * server/index.ts on a fresh data folder (migrations and the demo seed), again on the same folder
 * (a restart), and on that folder with `cases` generated cases added to the demo group. The
 * baseline is the bare Express child started the same way.
 */
export async function benchStartup(tmp: string, opts: { cases: number }): Promise<StartupReport> {
  const bareChild = await startChild(path.join(ROOT, "bench/servers/bare-server.ts"), { ready: /READY (\d+)/, reportRss: true });
  const bareStop = await bareChild.child.stop();
  const bare = { readyMs: bareChild.readyMs, maxRssMb: bareStop.maxRssKb === null ? null : bareStop.maxRssKb / 1024 };

  const dataDir = path.join(tmp, "startup-data");
  fs.mkdirSync(dataDir, { recursive: true });
  const runs: StartupFigure[] = [];
  const record = (label: string, r: Awaited<ReturnType<typeof startServer>>) =>
    runs.push({ label, ...r, ratio: r.readyMs / bare.readyMs });

  record("empty folder (migrations + demo seed)", await startServer(dataDir));
  record("restart, demo data only", await startServer(dataDir));

  const handle = await openDatabase({ dataDir: path.join(dataDir, "db") });
  try {
    const groupId = await demoGroupId(handle.db);
    const [author] = await handle.db.select({ id: user.id }).from(user).limit(1);
    if (!groupId || !author) throw new Error("the demo seed did not run");
    await insertGeneratedCases(handle.db, { groupId, authorId: author.id, from: 0, to: opts.cases });
  } finally {
    await handle.close();
  }
  record(`restart, ${opts.cases.toLocaleString("en")} cases`, await startServer(dataDir));
  return { bare, runs };
}
