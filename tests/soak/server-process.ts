import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { insertGeneratedCases } from "../../bench/seed-cases";
import { ROOT, startChild, type Child } from "../../bench/child";
import { openDatabase } from "../../db/client";
import { DEMO_ACCOUNTS, demoGroupId, seedDemo } from "../../db/seed";
import { user } from "../../db/schema";
import { eq } from "drizzle-orm";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";

/*
 * The real server as a child process (node --import tsx server/index.ts) on a PGlite data folder,
 * on a loopback port, for the soak tests. Loopback only; every loop that uses it is bounded.
 */

export async function freePort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, "127.0.0.1", r));
  const port = (srv.address() as net.AddressInfo).port;
  await new Promise((r) => srv.close(r));
  return port;
}

/** A fresh data folder holding the demo group and `cases` generated cases of it. */
export async function prepareDataDir(cases: number): Promise<string> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "phasewise-soak-"));
  const handle = await openDatabase({ dataDir: path.join(dataDir, "db") });
  try {
    const { auth } = createApp({ db: handle.db, dbKind: handle.kind, mail: createRecordingMailer(), quiet: true, dataDir });
    await seedDemo(handle.db, auth);
    const groupId = (await demoGroupId(handle.db))!;
    const [chemist] = await handle.db.select({ id: user.id }).from(user).where(eq(user.email, DEMO_ACCOUNTS[2].email));
    if (cases > 0) await insertGeneratedCases(handle.db, { groupId, authorId: chemist!.id, from: 0, to: cases });
  } finally {
    await handle.close();
  }
  return dataDir;
}

export interface RunningServer {
  base: string;
  child: Child;
  /** SIGKILL: no shutdown hook runs, nothing is flushed by us */
  kill: () => Promise<void>;
  stop: () => Promise<void>;
}

export async function startServer(dataDir: string, port: number): Promise<RunningServer> {
  const base = `http://127.0.0.1:${port}`;
  const { child } = await startChild(path.join(ROOT, "server/index.ts"), {
    env: { PHASEWISE_DATA_DIR: dataDir, PORT: String(port), PHASEWISE_DEMO: "1", DATABASE_URL: "", PUBLIC_URL: base, PHASEWISE_WEB_DIR: path.join(dataDir, "no-web") },
    ready: /Phasewise ready/,
    timeoutMs: 120_000,
  });
  const exited = new Promise<void>((r) => (child.proc.exitCode !== null ? r() : child.proc.once("exit", () => r())));
  return {
    base,
    child,
    kill: async () => {
      child.proc.kill("SIGKILL");
      await exited;
    },
    stop: async () => {
      await child.stop();
    },
  };
}

/** Signs in a demo account; the cookie is a database session, so it outlives a restart. */
export async function signIn(base: string, account: (typeof DEMO_ACCOUNTS)[number]): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ email: account.email, password: account.password }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

export function client(base: string, cookie: string) {
  return (p: string, init: { method?: string; body?: unknown; timeoutMs?: number } = {}) =>
    fetch(`${base}${p}`, {
      method: init.method ?? "GET",
      headers: { "content-type": "application/json", origin: base, cookie },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      signal: AbortSignal.timeout(init.timeoutMs ?? 120_000),
    });
}
