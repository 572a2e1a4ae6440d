import fs from "node:fs";
import { SEARCH_QUERIES, generatedCase, seededRandom } from "../../bench/case-fixtures";
import { LAYER_BODY } from "../../bench/http";
import { percentile } from "../../bench/stats";
import { DEMO_ACCOUNTS } from "../../db/seed";
import { client, freePort, prepareDataDir, signIn, startServer, type RunningServer } from "./server-process";

/*
 * Load: 200 concurrent connections for 60 s against the real server process on a PGlite folder
 * holding 2,000 cases, mixing list reads, case reads, searches, layer checks and case writes from
 * the three demo accounts. Loopback only, bounded by time. Zero 5xx, zero failed connections,
 * every acknowledged write readable afterwards, and no connection starved: the slowest answer
 * comes within a third of the run (the embedded database once held the event loop for a whole
 * queue of queries, and new connections waited in the accept queue for up to a minute; db/client.ts).
 */

const CONNECTIONS = 200;
const DURATION_MS = 60_000;
const SEEDED_CASES = 2_000;

type Op = "list" | "read" | "search" | "layers" | "write";
const MIX: [Op, number][] = [
  ["list", 0.25],
  ["read", 0.25],
  ["search", 0.2],
  ["layers", 0.15],
  ["write", 0.15],
];

let dataDir = "";
let server: RunningServer;

beforeAll(async () => {
  dataDir = await prepareDataDir(SEEDED_CASES);
  server = await startServer(dataDir, await freePort());
}, 300_000);

afterAll(async () => {
  await server?.stop();
  if (dataDir) fs.rmSync(dataDir, { recursive: true, force: true });
});

describe(`${CONNECTIONS} connections for ${DURATION_MS / 1000} s`, () => {
  it("answers every request below 500 and loses no acknowledged write", async () => {
    const cookies = await Promise.all(DEMO_ACCOUNTS.map((a) => signIn(server.base, a)));
    const calls = cookies.map((c) => client(server.base, c));
    const firstPage = (await (await calls[0]!("/api/cases?limit=100")).json()) as { cases: { id: string }[] };
    const known = firstPage.cases.map((c) => c.id);
    expect(known.length).toBeGreaterThan(50);

    const latency = new Map<Op, number[]>(MIX.map(([op]) => [op, []]));
    const statuses = new Map<number, number>();
    const failures: string[] = [];
    const written: { id: string; title: string }[] = [];
    const deadline = Date.now() + DURATION_MS;

    const worker = async (w: number) => {
      const rnd = seededRandom(w + 1);
      const call = calls[w % calls.length]!;
      for (let i = 0; Date.now() < deadline; i++) {
        let x = rnd();
        const op = MIX.find(([, share]) => (x -= share) < 0)?.[0] ?? "list";
        const t0 = performance.now();
        try {
          let res: Response;
          if (op === "list") res = await call(`/api/cases?limit=20&offset=${Math.floor(rnd() * 500)}`);
          else if (op === "read") res = await call(`/api/cases/${known[Math.floor(rnd() * known.length)]}`);
          else if (op === "search") res = await call(`/api/cases?q=${encodeURIComponent(SEARCH_QUERIES[Math.floor(rnd() * SEARCH_QUERIES.length)]!)}&limit=20`);
          else if (op === "layers") res = await call("/api/layers/predict", { method: "POST", body: LAYER_BODY });
          else {
            const title = `load ${w}-${i} ${Math.floor(rnd() * 1e9)}`;
            res = await call("/api/cases", { method: "POST", body: { ...generatedCase(50_000 + w * 1_000 + i), title } });
            if (res.status === 201) written.push({ id: ((await res.clone().json()) as { id: string }).id, title });
          }
          await res.arrayBuffer();
          statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
          if (res.status >= 500) failures.push(`${op} → ${res.status}`);
          latency.get(op)!.push(performance.now() - t0);
        } catch (err) {
          failures.push(`${op} → ${(err as Error).message}`);
        }
      }
    };
    await Promise.all(Array.from({ length: CONNECTIONS }, (_, w) => worker(w)));

    // Every acknowledged write is there, with its title.
    const lost: string[] = [];
    for (const w of written) {
      const res = await calls[0]!(`/api/cases/${w.id}`);
      const body = (await res.json()) as { title?: string };
      if (res.status !== 200 || body.title !== w.title) lost.push(`${w.title}: ${res.status}`);
    }

    const all = [...latency.values()].flat();
    const slowest = Math.max(...all);
    const line = (op: string, xs: number[]) =>
      `${op.padEnd(7)} n=${String(xs.length).padStart(6)}  p50 ${percentile(xs, 50).toFixed(0)} ms  p95 ${percentile(xs, 95).toFixed(0)} ms  p99 ${percentile(xs, 99).toFixed(0)} ms`;
    console.log(
      [
        `load: ${CONNECTIONS} connections, ${DURATION_MS / 1000} s, ${all.length} answers (${(all.length / (DURATION_MS / 1000)).toFixed(0)} req/s), statuses ${JSON.stringify(Object.fromEntries(statuses))}`,
        ...[...latency.entries()].map(([op, xs]) => line(op, xs)),
        line("all", all),
        `slowest answer ${slowest.toFixed(0)} ms`,
        `writes acknowledged ${written.length}, lost ${lost.length}`,
      ].join("\n"),
    );
    expect(failures.slice(0, 20)).toEqual([]);
    expect(lost).toEqual([]);
    expect(written.length).toBeGreaterThan(0);
    expect(all.length).toBeGreaterThan(CONNECTIONS);
    expect(slowest).toBeLessThan(DURATION_MS / 3);
  }, 300_000);
});
