import http from "node:http";
import type { AddressInfo } from "node:net";
import fc from "fast-check";
import { sql } from "drizzle-orm";
import pg from "pg";
import { generatedCase } from "../../bench/case-fixtures";
import { LAYER_BODY, PLAN_BODY } from "../../bench/http";
import { ORIGIN, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { registeredRoutes, type RegisteredRoute } from "./route-list";

/*
 * Bad input, property-based: every route the app registers (read from its router stack) gets
 * generated bodies, query strings and path parameters — wrong types, huge strings, deep nesting,
 * unicode, negative and non-finite numbers, broken JSON — from a signed-in owner. Two properties:
 * the server never answers 5xx, and a refused request (4xx) changes no row in any table (a row
 * trigger on every table counts changes). Failures are collected, not shrunk, so one run lists them all.
 */

const SEED = Number(process.env.PHASEWISE_FUZZ_SEED ?? 20_261_201);
/** PHASEWISE_FUZZ_SCALE shrinks or grows every run count (1 in CI: at least 10k requests). */
const SCALE = Number(process.env.PHASEWISE_FUZZ_SCALE ?? 1);
const RUNS = {
  body: Math.ceil(35 * SCALE),
  query: Math.ceil(20 * SCALE),
  params: Math.ceil(12 * SCALE),
  /** the public compute routes run mostly anonymously, so they are cheap: most of the deep fuzzing goes there */
  publicMutation: Math.ceil(1_500 * SCALE),
  mutation: Math.ceil(100 * SCALE),
};

let t: TestApp;
let server: http.Server;
let base = "";
let cookie = "";
/** Real records by the path segment before their parameter ("cases" → a case of the owner's group). */
const ids: Record<string, string> = { solvents: "toluene", remedies: "saturated-brine" };
let executed = 0;
let lastCount = 0;

interface Failure {
  route: string;
  status: number;
  changed: string[];
  request: string;
  answer: string;
}
const failures: Failure[] = [];

/**
 * On PostgreSQL the API suites share one database, and other files' writes would trip the row
 * triggers: this file takes a database of its own there, dropped afterwards.
 */
async function ownDatabase(shared: string) {
  const name = `phasewise_fuzz_${Date.now().toString(36)}_${process.pid}`;
  const admin = async (statement: string) => {
    const c = new pg.Client({ connectionString: shared });
    await c.connect();
    try {
      await c.query(statement);
    } finally {
      await c.end();
    }
  };
  await admin(`create database ${name}`);
  const url = new URL(shared);
  url.pathname = `/${name}`;
  return { url: url.toString(), drop: () => admin(`drop database if exists ${name} with (force)`) };
}
let own: Awaited<ReturnType<typeof ownDatabase>> | null = null;

beforeAll(async () => {
  const shared = process.env.PHASEWISE_TEST_DATABASE_URL;
  if (shared) {
    own = await ownDatabase(shared);
    process.env.PHASEWISE_TEST_DATABASE_URL = own.url;
  }
  try {
    t = await startTestApp();
  } finally {
    if (shared) process.env.PHASEWISE_TEST_DATABASE_URL = shared;
  }
  server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const g = await groupWithRoles(t, "fuzz");
  ids.groups = g.groupId;
  const created = await g.owner.agent.post("/api/cases").send(generatedCase(2));
  if (created.status !== 201) throw new Error(`case create failed: ${created.status} ${created.text}`);
  ids.cases = created.body.id;
  const attempt = await g.owner.agent.post(`/api/cases/${created.body.id}/attempts`).send({ remedyId: "saturated-brine", outcome: "partly" });
  ids.attempts = attempt.body.id;
  const members = await g.owner.agent.get(`/api/groups/${g.groupId}/members`);
  ids.members = (members.body.members ?? members.body)?.find?.((m: { role: string }) => m.role === "chemist")?.id ?? "";

  // The owner's own cookie, for plain fetch (faster than a supertest server per request).
  const signIn = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: ORIGIN },
    body: JSON.stringify({ email: g.owner.email, password: g.owner.password }),
  });
  cookie = signIn.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");

  // Count every row change, table by table.
  await t.db.execute(sql`create table fuzz_changes (id serial primary key, tbl text not null)`);
  await t.db.execute(
    sql.raw(`create function fuzz_note_change() returns trigger language plpgsql as $$
      begin insert into fuzz_changes (tbl) values (TG_TABLE_NAME); return null; end $$`),
  );
  const tables = rowsOf<{ table_name: string }>(
    await t.db.execute(
      sql`select table_name from information_schema.tables where table_schema = current_schema() and table_type = 'BASE TABLE' and table_name <> 'fuzz_changes'`,
    ),
  );
  for (const { table_name } of tables) {
    await t.db.execute(sql.raw(`create trigger fuzz_track after insert or update or delete on "${table_name}" for each row execute function fuzz_note_change()`));
  }
  lastCount = await changeCount();
}, 120_000);

afterAll(async () => {
  server?.closeAllConnections();
  server?.close();
  await t?.close();
  await own?.drop();
});

/** Rows of a raw query on PGlite and node-postgres alike. */
const rowsOf = <T>(result: unknown): T[] => (result as { rows: T[] }).rows;

async function changeCount(): Promise<number> {
  // The serial id, not count(*): the table grows with every accepted write.
  return Number(rowsOf<{ n: number }>(await t.db.execute(sql`select coalesce(max(id), 0)::int as n from fuzz_changes`))[0]?.n ?? 0);
}

async function changedTablesSince(n: number): Promise<string[]> {
  return rowsOf<{ tbl: string }>(await t.db.execute(sql`select distinct tbl from fuzz_changes where id > ${n}`)).map((x) => x.tbl);
}

interface Probe {
  path: string;
  query?: string;
  /** raw request body text */
  body?: string;
  contentType?: string;
  signedIn?: boolean;
  /** a compute route that never writes: its run is checked for changes once at the end, not per request */
  writesNothing?: boolean;
}

/** Sends one request; records a failure on 5xx, or on a refused request that changed a row. */
async function probe(route: RegisteredRoute, p: Probe): Promise<void> {
  const before = lastCount;
  const url = `${base}${p.path}${p.query ? `?${p.query}` : ""}`;
  const headers: Record<string, string> = { origin: ORIGIN };
  if (p.signedIn !== false) headers.cookie = cookie;
  if (p.body !== undefined) headers["content-type"] = p.contentType ?? "application/json";
  const res = await fetch(url, { method: route.method, headers, body: route.method === "GET" || route.method === "HEAD" ? undefined : p.body });
  const answer = await res.text();
  executed += 1;
  if (p.writesNothing) {
    if (res.status >= 500) failures.push({ route: `${route.method} ${route.path}`, status: res.status, changed: [], request: `${p.path} ${(p.body ?? "").slice(0, 300)}`, answer: answer.slice(0, 300) });
    return;
  }
  // Requests run one at a time, so the count after one is the count before the next.
  const after = await changeCount();
  lastCount = after;
  const changed = res.status >= 400 && after !== before ? await changedTablesSince(before) : [];
  if (res.status >= 500 || changed.length > 0) {
    failures.push({
      route: `${route.method} ${route.path}`,
      status: res.status,
      changed,
      request: `${p.path}${p.query ? `?${p.query}` : ""} ${(p.body ?? "").slice(0, 300)}`,
      answer: answer.slice(0, 300),
    });
  }
}

// ── generators ───────────────────────────────────────────────────────────────

/** Field names our schemas use, so generated objects reach past the first "unknown key". */
const FIELD_NAMES = [
  "organic", "aqueous", "solvent", "solute", "volumeMl", "concentration", "value", "unit", "temperatureC", "dissolvedSolidsG",
  "title", "system", "notes", "tags", "causes", "attempts", "remedyId", "outcome", "minutes", "seen", "kind", "status",
  "components", "washes", "repeats", "pKa", "name", "role", "email", "password", "q", "limit", "offset", "sort", "order",
  "from", "to", "verified", "attemptId", "reason", "field", "solventKey", "source", "pressureMbar", "vaporTemperatureC",
  "candidates", "organicLayer", "into", "message", "__proto__", "constructor", "prototype",
];
const key = fc.oneof(fc.constantFrom(...FIELD_NAMES), fc.string({ maxLength: 12 }));

/** A marker replaced by a non-finite number literal after JSON.stringify (JSON has no Infinity). */
const INF = "\u0000INF\u0000";
const weirdNumber = fc.oneof(
  fc.double(),
  fc.integer(),
  fc.constantFrom(-0, -1, -1e308, 1e308, 5e-324, 2 ** 53 + 1, -273.16, 1e-300, INF, `-${INF}`),
);
const weirdString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: "grapheme", maxLength: 40 }),
  fc.string({ unit: "binary", maxLength: 40 }),
  fc.constantFrom(
    "", " ", "\u0000", "\uFEFF", "\u202Eevil", "e\u0301", "../../etc/passwd", "..\\..\\boot.ini", "<script>alert(1)</script>",
    "'; drop table cases; --", "%00", "NaN", "Infinity", "-1", "1e999", "true", "null", "__proto__", "saturated", "DCM", "brine",
  ),
  fc.integer({ min: 1_000, max: 300_000 }).chain((n) => fc.constantFrom("x".repeat(n), "y", "")),
  fc.integer({ min: 10, max: 5_000 }).chain((n) => fc.constantFrom("🧪".repeat(n), "🧪", "é")),
);
const leaf = fc.oneof(weirdNumber, weirdString, fc.boolean(), fc.constant(null));
const { value: jsonValue } = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: "small", withCrossShrink: true }, leaf, fc.array(tie("value"), { maxLength: 4 }), fc.dictionary(key, tie("value"), { maxKeys: 6 })),
}));
const deepNest = fc
  .tuple(fc.integer({ min: 50, max: 20_000 }), fc.boolean())
  .map(([n, arr]) => (arr ? "[".repeat(n) + "]".repeat(n) : '{"a":'.repeat(n) + "1" + "}".repeat(n)));

const toJson = (v: unknown) => JSON.stringify(v).replaceAll(JSON.stringify(INF), "1e999").replaceAll(JSON.stringify(`-${INF}`), "-1e999");

/** One body over express.json's 1 MB limit (a 413), among a few small ones so it stays rare. */
const OVERSIZED = [`{"notes":"${"n".repeat(1_100_000)}"}`, "{}", "[]", "null", '""', "0", "-1e999", "[1e999]"];

/** Raw body texts: generated JSON, deep nesting, broken JSON, bodies over the 1 MB limit. */
const bodyText = fc.oneof(
  { weight: 6, arbitrary: jsonValue.map(toJson) },
  { weight: 1, arbitrary: deepNest },
  { weight: 1, arbitrary: fc.string({ maxLength: 60 }) },
  { weight: 1, arbitrary: fc.constantFrom('{"a":', "{'single':1}", "[1,2,", "\u0000", '{"__proto__":{"admin":true}}', '{"a":1,"a":2}') },
  { weight: 1, arbitrary: fc.constantFrom(...OVERSIZED) },
);
const contentType = fc.constantFrom("application/json", "application/json", "application/json", "text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x");

const queryString = fc
  .array(fc.tuple(key, fc.oneof(weirdString, weirdNumber.map(String))), { maxLength: 6 })
  .map((pairs) => new URLSearchParams(pairs.map(([k, v]) => [k, String(v).slice(0, 4000)])).toString());

const paramValue = fc.oneof(weirdString.map((s) => s.slice(0, 3000)), fc.uuid(), fc.constantFrom("0", "-1", "null", "undefined", ".", ".."));

/** Fills ":id"-style parameters: the real record most of the time when we have one. */
function fillPath(path: string, values: string[] | null): string {
  let i = 0;
  return path.replace(/:(\w+)/g, (_m, name: string, offset: number) => {
    const before = path.slice(0, offset).split("/").filter(Boolean).pop() ?? "";
    const own = name === "attemptId" ? ids.attempts : name === "memberId" ? ids.members : ids[before];
    const v = values?.[i++];
    return encodeURIComponent(v ?? own ?? crypto.randomUUID());
  });
}

/** Valid bodies for the routes that take one, to mutate one field at a time. */
const SEED_BODIES: Record<string, unknown> = {
  "POST /api/layers/predict": LAYER_BODY,
  "POST /api/plans/compute": PLAN_BODY,
  "POST /api/cases": generatedCase(5),
  "PATCH /api/cases/:id": { title: "Hazy organic after the second wash", notes: "Cleared with brine.", status: "resolved" },
  "POST /api/cases/:id/attempts": { remedyId: "saturated-brine", amount: "20 mL", minutes: 10, outcome: "cleared" },
  "POST /api/troubleshoot": { system: { organic: [{ solvent: "ethyl acetate", volumeMl: 100 }], aqueous: { solute: "water", volumeMl: 100 } } },
  "POST /api/evaporation": { solvent: "toluene", pressureMbar: 77 },
  "POST /api/solvents/rank": { organicLayer: "top", noHalogen: true, bpMinC: 60, bpMaxC: 100 },
  "POST /api/groups": { name: "Fuzzed group" },
};

const PUBLIC_SEEDS = new Set(["POST /api/layers/predict", "POST /api/plans/compute", "POST /api/troubleshoot", "POST /api/evaporation", "POST /api/solvents/rank"]);

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** Every path into a JSON value (object keys and array indexes). */
function pathsOf(v: Json, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [prefix];
  if (Array.isArray(v)) v.forEach((x, i) => out.push(...pathsOf(x, [...prefix, i])));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) out.push(...pathsOf(x, [...prefix, k]));
  return out;
}

function setAt(v: Json, path: (string | number)[], replacement: Json): Json {
  if (path.length === 0) return replacement;
  const [head, ...rest] = path;
  const copy: Json = Array.isArray(v) ? [...v] : { ...(v as Record<string, Json>) };
  (copy as Record<string | number, Json>)[head!] = setAt((copy as Record<string | number, Json>)[head!] ?? null, rest, replacement);
  return copy;
}

// ── the runs ─────────────────────────────────────────────────────────────────

const isWrite = (r: RegisteredRoute) => r.method !== "GET" && r.method !== "HEAD";

async function fuzz<T>(arb: fc.Arbitrary<T>, runs: number, seedOffset: number, send: (x: T) => Promise<void>) {
  await fc.assert(
    fc.asyncProperty(arb, async (x) => {
      await send(x);
      return true;
    }),
    { numRuns: runs, seed: SEED + seedOffset, endOnFailure: true },
  );
}

/** The failures recorded since `from` (each test reports its own). */
function report(from: number) {
  return failures.slice(from, from + 15).map((f) => `${f.route} → ${f.status}${f.changed.length ? ` (changed ${f.changed.join(", ")})` : ""}\n  sent ${f.request}\n  got  ${f.answer}`);
}

describe("bad input on every registered route", () => {
  let routes: RegisteredRoute[] = [];
  beforeAll(() => {
    routes = registeredRoutes(t.app);
  });

  it("lists the app's routes from its router, including the compute and case routes", () => {
    const names = routes.map((r) => `${r.method} ${r.path}`);
    expect(names).toEqual(expect.arrayContaining(["POST /api/layers/predict", "GET /api/health", "POST /api/groups"]));
    expect(routes.length).toBeGreaterThan(10);
  });

  it("never answers 5xx to generated JSON bodies, and a refused body changes nothing", async () => {
    const start = failures.length;
    let offset = 0;
    for (const route of routes.filter(isWrite)) {
      await fuzz(fc.tuple(bodyText, contentType, fc.boolean()), RUNS.body, offset++, ([body, type, signedIn]) =>
        probe(route, { path: fillPath(route.path, null), body, contentType: type, signedIn: signedIn || route.path.includes(":") }),
      );
    }
    expect(report(start)).toEqual([]);
  }, 600_000);

  it("never answers 5xx to one bad field in an otherwise valid body", async () => {
    const start = failures.length;
    let offset = 1_000;
    for (const [name, seedBody] of Object.entries(SEED_BODIES)) {
      const route = routes.find((r) => `${r.method} ${r.path}` === name);
      if (!route) continue; // an area not registered in this build
      const paths = pathsOf(seedBody as Json);
      const mutation = fc.tuple(fc.constantFrom(...paths), jsonValue as fc.Arbitrary<Json>);
      // Public compute routes mostly anonymously (cheaper: no session lookup), now and then as a member.
      const isPublic = PUBLIC_SEEDS.has(name);
      const before = await changeCount();
      await fuzz(fc.tuple(mutation, fc.integer({ min: 0, max: 7 })), isPublic ? RUNS.publicMutation : RUNS.mutation, offset++, ([[path, v], dice]) =>
        probe(route, { path: fillPath(route.path, null), body: toJson(setAt(seedBody as Json, path, v)), signedIn: !isPublic || dice === 0, writesNothing: isPublic }),
      );
      if (isPublic) {
        // A compute route stores nothing, accepted or refused: any change in its whole run is a failure.
        lastCount = await changeCount();
        if (lastCount !== before) failures.push({ route: name, status: 0, changed: await changedTablesSince(before), request: "(the whole run)", answer: "" });
      }
    }
    expect(report(start)).toEqual([]);
  }, 600_000);

  it("never answers 5xx to generated query strings", async () => {
    const start = failures.length;
    let offset = 2_000;
    for (const route of routes) {
      const runs = route.method === "GET" ? RUNS.query : Math.ceil(RUNS.query / 6);
      await fuzz(queryString, runs, offset++, (query) => probe(route, { path: fillPath(route.path, null), query, body: isWrite(route) ? "{}" : undefined }));
    }
    expect(report(start)).toEqual([]);
  }, 600_000);

  it("never answers 5xx to generated path parameters", async () => {
    const start = failures.length;
    let offset = 3_000;
    for (const route of routes.filter((r) => r.path.includes(":"))) {
      const count = route.path.split(":").length - 1;
      await fuzz(fc.array(paramValue, { minLength: count, maxLength: count }), RUNS.params, offset++, (values) =>
        probe(route, { path: fillPath(route.path, values), body: isWrite(route) ? "{}" : undefined }),
      );
    }
    expect(report(start)).toEqual([]);
  }, 600_000);

  it("refuses a NUL byte in a path or in text to store with 400, storing nothing (PostgreSQL keeps no NUL)", async () => {
    const start = failures.length;
    const cases = routes.find((r) => r.method === "POST" && r.path === "/api/cases")!;
    const read = routes.find((r) => r.method === "GET" && r.path === "/api/cases/:id")!;
    await probe(cases, { path: "/api/cases", body: JSON.stringify({ ...generatedCase(9), title: "Rag layer\u0000 after the wash" }) });
    await probe(read, { path: "/api/cases/%00" });
    expect(report(start)).toEqual([]);
    const res = await fetch(`${base}/api/cases/a%00b`, { headers: { cookie, origin: ORIGIN } });
    expect(res.status).toBe(400);
  });

  it("sent at least 10k generated requests in all", () => {
    console.log(`fuzz: ${executed} requests over ${routes.length} routes, seed ${SEED}`);
    expect(executed).toBeGreaterThanOrEqual(10_000 * Math.min(1, SCALE));
  });
});
