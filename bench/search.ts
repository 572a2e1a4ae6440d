import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import type { AddressInfo } from "node:net";
import { sql } from "drizzle-orm";
import { openDatabase, type Database } from "../db/client";
import { createApp } from "../server/app";
import { createRecordingMailer } from "../server/mail";
import { SEARCH_MATCH_CAP } from "../server/routes/cases";
import { SEARCH_QUERIES } from "./case-fixtures";
import { insertGeneratedCases } from "./seed-cases";
import { percentile } from "./stats";

export interface SearchSize {
  cases: number;
  /** seconds to insert this step's cases in bulk */
  insertS: number;
  /** the first search after the cases changed (catches the group's typo vocabulary up) */
  coldMs: number;
  p50Ms: number;
  p95Ms: number;
  /** p95 at this size ÷ p95 at the smallest size */
  growth: number;
  perQuery: { q: string; p50Ms: number; total: number }[];
  /** the pieces of one broad search ("brine", most cases match), timed in SQL directly (see breakdown) */
  breakdown: { versionCheckMs: number; countMatchesMs: number; rankTop20Ms: number; matches: number };
}

export interface SearchReport {
  rounds: number;
  sizes: SearchSize[];
}

/**
 * Where a broad search's time goes, in SQL directly: the typo vocabulary's check for changed
 * cases (nothing changed), counting matches up to the cap, ranking the newest cap matches for
 * the top 20; `matches` is the uncapped count.
 */
async function breakdown(db: Database, groupId: string) {
  const time = async (q: ReturnType<typeof sql>) => {
    const runs: number[] = [];
    let out: unknown;
    for (let i = 0; i < 5; i++) {
      const t0 = performance.now();
      out = await db.execute(q);
      runs.push(performance.now() - t0);
    }
    return { ms: percentile(runs, 50), rows: (out as { rows: Record<string, unknown>[] }).rows };
  };
  const tsq = sql`to_tsquery('simple', 'brine:*')`;
  const matching = sql`from cases where group_id = ${groupId} and not retired and search_vector @@ ${tsq}`;
  const snap = await time(sql`select pg_current_snapshot()::text as s`);
  const snapshot = String(snap.rows[0]?.s);
  const version = await time(
    sql`select pg_current_snapshot()::text, (select count(*) from case_search_stamps s where s.group_id = ${groupId}
      and s.xact >= ${snapshot.split(":")[0]}::bigint and not pg_visible_in_snapshot(s.xact::text::xid8, ${snapshot}::pg_snapshot))`,
  );
  const counted = await time(sql`select count(*)::int as n from (select 1 ${matching} limit ${SEARCH_MATCH_CAP + 1}) m`);
  const ranked = await time(
    sql`select id from (select id, occurred_at, ts_rank(search_vector, ${tsq}) as r ${matching} order by occurred_at desc, id desc limit ${SEARCH_MATCH_CAP}) c
      order by r desc, occurred_at desc limit 20`,
  );
  const all = await time(sql`select count(*)::int as n ${matching}`);
  return { versionCheckMs: version.ms, countMatchesMs: counted.ms, rankTop20Ms: ranked.ms, matches: Number(all.rows[0]?.n ?? 0) };
}

/** A signed-in client of an app on loopback: fetch with the session cookie and our Origin. */
export async function signedInClient(base: string, label: string) {
  const origin = base;
  const email = `${label}-${Date.now()}@bench.example`;
  const up = await fetch(`${base}/api/auth/sign-up/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin },
    body: JSON.stringify({ name: label, email, password: "bench-password-1" }),
  });
  if (up.status !== 200) throw new Error(`sign-up failed: ${up.status} ${await up.text()}`);
  const cookie = up.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const userId = ((await up.json()) as { user: { id: string } }).user.id;
  const call = (p: string, init: RequestInit = {}) =>
    fetch(`${base}${p}`, { ...init, headers: { "content-type": "application/json", origin, cookie, ...(init.headers ?? {}) } });
  return { call, cookie, userId, email };
}

/**
 * Case search through GET /api/cases?q=… on a PGlite data folder holding 1k, 20k and 100k
 * generated cases of one group, `rounds` passes over the query list at each size.
 */
export async function benchSearch(tmp: string, opts: { sizes: number[]; rounds: number }): Promise<SearchReport> {
  const dataDir = path.join(tmp, "search-data");
  fs.mkdirSync(dataDir, { recursive: true });
  const handle = await openDatabase({ dataDir: path.join(dataDir, "db") });
  // Listen first: better-auth checks the Origin against the base URL, which needs the port.
  const server = http.createServer();
  // The bulk inserts take longer than Node's 5 s keep-alive; keep the client's socket usable.
  server.keepAliveTimeout = 600_000;
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const { app } = createApp({ db: handle.db, dbKind: handle.kind, mail: createRecordingMailer(), baseURL: base, quiet: true, dataDir });
  server.on("request", app);
  try {
    const client = await signedInClient(base, "search-bench");
    const group = await client.call("/api/groups", { method: "POST", body: JSON.stringify({ name: "Search bench group" }) });
    if (group.status !== 201) throw new Error(`group create failed: ${group.status}`);
    const groupId = ((await group.json()) as { id: string }).id;

    const search = async (q: string) => {
      const t0 = performance.now();
      const res = await client.call(`/api/cases?q=${encodeURIComponent(q)}&limit=20`);
      const body = (await res.json()) as { total?: number };
      const ms = performance.now() - t0;
      if (res.status !== 200) throw new Error(`search "${q}" answered ${res.status}`);
      return { ms, total: body.total ?? 0 };
    };

    const sizes: SearchSize[] = [];
    let have = 0;
    for (const n of opts.sizes) {
      const t0 = performance.now();
      await insertGeneratedCases(handle.db, { groupId, authorId: client.userId, from: have, to: n });
      const insertS = (performance.now() - t0) / 1000;
      have = n;
      const cold = await search(SEARCH_QUERIES[0]!);
      const times: number[] = [];
      const perQuery = new Map<string, { ms: number[]; total: number }>();
      for (let r = 0; r < opts.rounds; r++) {
        for (const q of SEARCH_QUERIES) {
          const { ms, total } = await search(q);
          times.push(ms);
          const entry = perQuery.get(q) ?? { ms: [], total };
          entry.ms.push(ms);
          perQuery.set(q, entry);
        }
      }
      const p95 = percentile(times, 95);
      sizes.push({
        cases: n,
        insertS,
        coldMs: cold.ms,
        p50Ms: percentile(times, 50),
        p95Ms: p95,
        growth: sizes.length ? p95 / sizes[0]!.p95Ms : 1,
        perQuery: [...perQuery.entries()].map(([q, e]) => ({ q, p50Ms: percentile(e.ms, 50), total: e.total })),
        breakdown: await breakdown(handle.db, groupId),
      });
    }
    return { rounds: opts.rounds, sizes };
  } finally {
    server.closeAllConnections();
    server.close();
    await handle.close();
  }
}
