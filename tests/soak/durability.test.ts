import fs from "node:fs";
import path from "node:path";
import { sql } from "drizzle-orm";
import { generatedCase, seededRandom } from "../../bench/case-fixtures";
import { openDatabase } from "../../db/client";
import { DEMO_ACCOUNTS } from "../../db/seed";
import { client, freePort, prepareDataDir, signIn, startServer, type RunningServer } from "./server-process";

/*
 * Durability: the real server process takes a stream of case writes (new cases with their
 * attempts in one transaction, and note edits) and is killed with SIGKILL at a random moment,
 * 20 times. After each restart every write it acknowledged (201/200) must be there and intact;
 * a write cut off mid-flight may be there or not, but never half: a case's attempts and its
 * follower row were written in the same transaction as the case.
 */

const TRIALS = 20;
const WRITERS = 4;
/** Older acknowledged writes re-read after each kill, at random (every one is read after the last kill). */
const OLDER_SAMPLE = 50;
const rnd = seededRandom(8_2026);

interface Written {
  id: string;
  title: string;
  attempts: { remedyId: string | null; outcome: string }[];
  /** the last acknowledged notes, and notes sent whose answer never came */
  notes: string;
  maybeNotes: Set<string>;
}

let dataDir = "";
let port = 0;
const acknowledged = new Map<string, Written>();
let sent = 0;
let unanswered = 0;

beforeAll(async () => {
  dataDir = await prepareDataDir(0);
  port = await freePort();
}, 120_000);

afterAll(() => {
  if (dataDir) fs.rmSync(dataDir, { recursive: true, force: true });
});

async function writerLoop(call: ReturnType<typeof client>, trial: number, writer: number, stopAt: { killed: boolean }) {
  const mine: Written[] = [];
  for (let i = 0; !stopAt.killed && i < 10_000; i++) {
    const editOld = mine.length > 0 && rnd() < 0.3;
    sent += 1;
    if (editOld) {
      const target = mine[Math.floor(rnd() * mine.length)]!;
      const notes = `edited in trial ${trial} by writer ${writer}, step ${i}`;
      target.maybeNotes.add(notes);
      try {
        const res = await call(`/api/cases/${target.id}`, { method: "PATCH", body: { notes } });
        if (res.status !== 200) throw new Error(`PATCH answered ${res.status}: ${await res.text()}`);
        await res.arrayBuffer();
        target.notes = notes;
        target.maybeNotes.clear();
      } catch (err) {
        if (!stopAt.killed) throw err;
        unanswered += 1;
      }
      continue;
    }
    const body = generatedCase(trial * 100_000 + writer * 10_000 + i);
    const attempts = body.attempts ?? [];
    const title = `durability ${trial}-${writer}-${i} [${attempts.length} attempts]`;
    try {
      const res = await call("/api/cases", { method: "POST", body: { ...body, title } });
      if (res.status !== 201) throw new Error(`POST answered ${res.status}: ${await res.text()}`);
      const created = (await res.json()) as { id: string };
      const w: Written = {
        id: created.id,
        title,
        attempts: attempts.map((a) => ({ remedyId: a.remedyId ?? null, outcome: a.outcome })),
        notes: body.notes ?? "",
        maybeNotes: new Set(),
      };
      acknowledged.set(w.id, w);
      mine.push(w);
    } catch (err) {
      if (!stopAt.killed) throw err;
      unanswered += 1;
    }
  }
}

async function checkIntact(call: ReturnType<typeof client>, ws: Iterable<Written>): Promise<string[]> {
  const problems: string[] = [];
  for (const w of ws) {
    const res = await call(`/api/cases/${w.id}`);
    if (res.status !== 200) {
      problems.push(`${w.title}: answered ${res.status} after restart`);
      continue;
    }
    const d = (await res.json()) as { title: string; notes: string; attempts: { remedyId: string | null; outcome: string; position: number }[] };
    if (d.title !== w.title) problems.push(`${w.title}: title is now ${d.title}`);
    if (d.notes !== w.notes && !w.maybeNotes.has(d.notes)) problems.push(`${w.title}: notes lost (have "${d.notes.slice(0, 60)}")`);
    const got = d.attempts.map((a) => ({ remedyId: a.remedyId, outcome: a.outcome }));
    if (JSON.stringify(got) !== JSON.stringify(w.attempts)) problems.push(`${w.title}: attempts ${JSON.stringify(got)} ≠ ${JSON.stringify(w.attempts)}`);
    if (d.attempts.some((a, i) => a.position !== i + 1)) problems.push(`${w.title}: attempt positions out of order`);
  }
  return problems;
}

describe("SIGKILL during a stream of case writes", () => {
  it(`keeps every acknowledged write intact across ${TRIALS} kills`, async () => {
    const problems: string[] = [];
    let cookie = "";
    let checkedUpTo = 0;
    for (let trial = 0; trial < TRIALS; trial++) {
      const server: RunningServer = await startServer(dataDir, port);
      const call = () => client(server.base, cookie);
      try {
        if (!cookie) cookie = await signIn(server.base, DEMO_ACCOUNTS[2]);
        // What was acknowledged before the last kill must have survived it: every write since the
        // previous check, and a sample of older ones (all of them are checked after the last kill).
        const all = [...acknowledged.values()];
        const older = all.slice(0, checkedUpTo);
        const sample = Array.from({ length: Math.min(OLDER_SAMPLE, older.length) }, () => older[Math.floor(rnd() * older.length)]!);
        problems.push(...(await checkIntact(call(), [...all.slice(checkedUpTo), ...sample])).map((p) => `after kill ${trial}: ${p}`));
        checkedUpTo = all.length;
        const flag = { killed: false };
        const loops = Array.from({ length: WRITERS }, (_, w) => writerLoop(call(), trial, w, flag));
        await new Promise((r) => setTimeout(r, 500 + Math.floor(rnd() * 3000)));
        flag.killed = true;
        await server.kill();
        await Promise.all(loops);
      } catch (err) {
        await server.kill();
        throw err;
      }
    }
    // One more start to check the last kill, then a direct look at the tables for half-written cases.
    const server = await startServer(dataDir, port);
    try {
      problems.push(...(await checkIntact(client(server.base, cookie), acknowledged.values())).map((p) => `after the last kill: ${p}`));
    } finally {
      await server.stop();
    }
    const handle = await openDatabase({ dataDir: path.join(dataDir, "db") });
    try {
      const rows = (
        (await handle.db.execute(sql`
          select c.title, (select count(*)::int from case_attempts a where a.case_id = c.id) as attempts,
                 (select count(*)::int from case_followers f where f.case_id = c.id) as followers
          from cases c where c.title like 'durability %'`)) as unknown as { rows: { title: string; attempts: number; followers: number }[] }
      ).rows;
      for (const r of rows) {
        const expected = Number(/\[(\d+) attempts\]/.exec(r.title)?.[1]);
        if (r.attempts !== expected || r.followers !== 1) problems.push(`half-written: ${r.title} has ${r.attempts} attempts, ${r.followers} followers`);
      }
      const found = rows.filter((r) => [...acknowledged.values()].some((w) => w.title === r.title)).length;
      console.log(
        `durability: ${TRIALS} SIGKILLs, ${sent} writes sent, ${acknowledged.size} cases acknowledged, ${found} of them found intact; ` +
          `${unanswered} writes cut off unanswered, ${rows.length - found} of the cut-off creates had committed (complete)`,
      );
      expect(found).toBe(acknowledged.size);
    } finally {
      await handle.close();
    }
    expect(problems).toEqual([]);
    expect(acknowledged.size).toBeGreaterThan(TRIALS);
  }, 900_000);
});
