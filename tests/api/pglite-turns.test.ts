import { PGlite } from "@electric-sql/pglite";
import { openDatabase, takeTurns } from "../../db/client";
import { sql } from "drizzle-orm";

/*
 * The embedded database runs queries on the server's own thread. A queue of waiting queries must
 * not hold the event loop for the whole queue: sockets (new connections, new requests) are served
 * between slices of it. Measured in completed queries when a callback queued behind them runs.
 */

const QUERIES = 300;

/** Queues QUERIES small queries, then counts how many had finished when the event loop next turned. */
async function finishedBeforeTheLoopTurned(client: PGlite): Promise<{ finished: number; order: number[] }> {
  let finished = 0;
  const order: number[] = [];
  const all = Array.from({ length: QUERIES }, (_, i) =>
    client.query<{ n: number }>("select $1::int as n, pg_sleep(0.0002)", [i]).then((r) => {
      finished++;
      order.push(r.rows[0]!.n);
    }),
  );
  const atTurn = await new Promise<number>((resolve) => setImmediate(() => resolve(finished)));
  await Promise.all(all);
  expect(finished).toBe(QUERIES);
  return { finished: atTurn, order };
}

describe("taking turns on the embedded database", () => {
  it("without it, a queue of queries runs through in one turn of the event loop (the failure it prevents)", async () => {
    const raw = new PGlite();
    try {
      await raw.waitReady;
      const { finished } = await finishedBeforeTheLoopTurned(raw);
      expect(finished).toBe(QUERIES);
    } finally {
      await raw.close();
    }
  });

  it("with it, the event loop turns before the queue is through, and the queries still run in arrival order", async () => {
    const raw = new PGlite();
    try {
      await raw.waitReady;
      const { finished, order } = await finishedBeforeTheLoopTurned(takeTurns(raw));
      expect(finished).toBeLessThan(QUERIES);
      expect(order).toEqual(Array.from({ length: QUERIES }, (_, i) => i));
    } finally {
      await raw.close();
    }
  });

  it("a transaction's own queries and PGlite's internal calls do not wait behind the queue (no deadlock), and a failed query does not stop the next", async () => {
    const handle = await openDatabase({ dataDir: "memory://" });
    try {
      const { db } = handle;
      await db.execute(sql`create temporary table turn_t (n int)`);
      await db.transaction(async (tx) => {
        await tx.execute(sql`insert into turn_t values (1)`);
        await tx.execute(sql`insert into turn_t values (2)`);
      });
      // a schema change makes PGlite re-read its array types from inside the call
      await db.execute(sql`create type turn_mood as enum ('calm', 'cloudy')`);
      await expect(db.execute(sql`select * from no_such_table`)).rejects.toThrow(/no_such_table/);
      const rows = await db.execute(sql`select count(*)::int as c from turn_t`);
      expect((rows as unknown as { rows: { c: number }[] }).rows[0]!.c).toBe(2);
    } finally {
      await handle.close();
    }
  });
});
