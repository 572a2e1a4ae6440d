import { AsyncLocalStorage } from "node:async_hooks";
import path from "node:path";
import { PGlite } from "@electric-sql/pglite";
import { sql } from "drizzle-orm";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import { drizzle as drizzlePglite } from "drizzle-orm/pglite";
import { migrate as migratePglite } from "drizzle-orm/pglite/migrator";
import { drizzle as drizzlePg } from "drizzle-orm/node-postgres";
import { migrate as migratePg } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import * as schema from "./schema";

export type Schema = typeof schema;
/** The one database type the server uses; PGlite and node-postgres both satisfy it. */
export type Database = PgDatabase<PgQueryResultHKT, Schema>;

export interface DatabaseHandle {
  db: Database;
  kind: "pglite" | "postgres";
  close(): Promise<void>;
}

const migrationsFolder = path.join(__dirname, "migrations");

export interface OpenOptions {
  /** postgres://… to use a PostgreSQL server; otherwise PGlite. */
  url?: string;
  /** PGlite data folder, or "memory://" for a throwaway database. */
  dataDir?: string;
}

/**
 * PGlite runs each query synchronously on the server's own thread, and its queue hands over to
 * the next query in a microtask: with many requests waiting, one turn of the event loop ran the
 * whole queue (about a second at 200 connections) and the server accepted new connections and
 * read new requests only between such turns, so a newly connected browser waited up to a minute
 * (tests/soak/load.test.ts). Here queries and transactions run in arrival order, one at a time,
 * and after SLICE_MS of them the next waits for a turn of the event loop (setImmediate), so
 * sockets are served at least every ~10 ms plus one query. (50 ms slices kept ~4 % more
 * throughput but let the slowest answer at 200 connections grow back to ~15 s; 10 ms: ~7 s.)
 * Queries inside a transaction run on its own handle and are not delayed.
 */
const SLICE_MS = 10;

export function takeTurns(client: PGlite): PGlite {
  // PGlite calls its own methods from inside a call (array types after a schema change):
  // those run at once, in the turn that made them.
  const turn = new AsyncLocalStorage<true>();
  let last: Promise<unknown> = Promise.resolve();
  let sliceStarted = 0;
  const nextTurn = () =>
    new Promise<void>((resolve) =>
      setImmediate(() => {
        sliceStarted = performance.now();
        resolve();
      }),
    );
  // Queries follow each other directly for up to a slice, then let the event loop turn once.
  const mayGoOn = () => (performance.now() - sliceStarted < SLICE_MS ? undefined : nextTurn());
  const inTurn = <T>(run: () => Promise<T>): Promise<T> => {
    if (turn.getStore()) return run();
    const result = last.then(mayGoOn).then(() => turn.run(true, run));
    last = result.catch(() => undefined);
    return result;
  };
  const query = client.query.bind(client);
  const exec = client.exec.bind(client);
  const transaction = client.transaction.bind(client);
  client.query = ((...args: Parameters<typeof query>) => inTurn(() => query(...args))) as typeof client.query;
  client.exec = ((...args: Parameters<typeof exec>) => inTurn(() => exec(...args))) as typeof client.exec;
  client.transaction = ((...args: Parameters<typeof transaction>) => inTurn(() => transaction(...args))) as typeof client.transaction;
  return client;
}

/** Opens the database and applies the committed migrations. */
export async function openDatabase(options: OpenOptions): Promise<DatabaseHandle> {
  if (options.url) {
    const pool = new Pool({ connectionString: options.url, max: 10 });
    const db = drizzlePg(pool, { schema }) as unknown as Database;
    // Several processes may start against one server: serialise migrations with an advisory lock.
    const client = await pool.connect();
    try {
      await client.query("select pg_advisory_lock(727301)");
      await migratePg(drizzlePg(client, { schema }), { migrationsFolder });
    } finally {
      await client.query("select pg_advisory_unlock(727301)").catch(() => undefined);
      client.release();
    }
    return { db, kind: "postgres", close: () => pool.end() };
  }
  const dataDir = options.dataDir ?? "memory://";
  const raw = dataDir.startsWith("memory://") ? new PGlite(dataDir) : new PGlite(path.resolve(dataDir));
  await raw.waitReady; // its start-up runs queries of its own, before any turn-taking
  const client = takeTurns(raw);
  const db = drizzlePglite(client, { schema });
  await migratePglite(db, { migrationsFolder });
  await db.execute(sql`select 1`);
  return { db: db as unknown as Database, kind: "pglite", close: () => client.close() };
}
