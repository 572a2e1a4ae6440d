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
  const client = dataDir.startsWith("memory://") ? new PGlite(dataDir) : new PGlite(path.resolve(dataDir));
  const db = drizzlePglite(client, { schema });
  await migratePglite(db, { migrationsFolder });
  await db.execute(sql`select 1`);
  return { db: db as unknown as Database, kind: "pglite", close: () => client.close() };
}
