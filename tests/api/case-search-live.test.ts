import { sql } from "drizzle-orm";
import { openDatabase, type DatabaseHandle } from "../../db/client";
import { createCaseBody } from "../../knowledge/contracts/cases";
import { createApp } from "../../server/app";
import { insertCase } from "../../server/case-records";
import { SearchVocabulary, VocabularyCache } from "../../server/case-search";
import { createRecordingMailer } from "../../server/mail";
import { SEARCH_MATCH_CAP } from "../../server/routes/cases";
import { couplingCase, createCase } from "./case-helpers";
import { ORIGIN, groupWithRoles, signUp, startTestApp, type Agent, type TestApp } from "./harness";
import { editDistance } from "../../knowledge/reference";

/*
 * The search's moving parts: a broad word counts and ranks at most SEARCH_MATCH_CAP cases (the
 * newest), and the typo vocabulary follows writes — from this app, from raw SQL and from a
 * second app on the same database — without reading the whole group again.
 */

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
}, 60_000);
afterAll(async () => {
  await t.close();
});

async function search(agent: Agent, query: string) {
  const res = await agent.get(`/api/cases?${query}`);
  if (res.status !== 200) throw new Error(`${res.status} ${res.text}`);
  return res.body as { cases: { id: string; title: string }[]; total: number; totalIsLowerBound: boolean };
}

describe("a word matching more cases than the cap", () => {
  const extra = 5;
  const n = SEARCH_MATCH_CAP + extra;
  /** ids by age, oldest first; case i happened i hours after the first */
  const ids: string[] = [];
  let g: Awaited<ReturnType<typeof groupWithRoles>>;
  // Titles carry the word (ranking above a notes match) in the oldest case and in case 600.
  const titled = (i: number) => i === 0 || i === 600;
  const abandoned = (i: number) => i % 10 === 3;

  beforeAll(async () => {
    g = await groupWithRoles(t, "broad");
    const start = Date.UTC(2024, 0, 1);
    await t.db.transaction(async (tx) => {
      for (let i = 0; i < n; i++) {
        const body = createCaseBody.parse(
          couplingCase({
            title: titled(i) ? `Gelatinous rag ${i}` : `Rag layer ${i}`,
            notes: `A gelatinous layer sat at the interface (${i}).`,
            status: abandoned(i) ? "abandoned" : "open",
            occurredAt: new Date(start + i * 3_600_000).toISOString(),
          }),
        );
        ids.push(await insertCase(tx, { groupId: g.groupId, authorId: g.lead.userId, body }));
      }
    });
  }, 120_000);

  it("reports the cap as a lower bound and ranks the newest cap matches only", async () => {
    const first = await search(g.chemist.agent, "q=gelatinous&limit=200");
    expect(first).toMatchObject({ total: SEARCH_MATCH_CAP, totalIsLowerBound: true });
    // Case 600's title match ranks first; case 0's does not count, it is older than the newest 1,000.
    expect(first.cases[0]!.id).toBe(ids[600]);
    const seen = [...first.cases.map((c) => c.id)];
    for (let offset = 200; offset < SEARCH_MATCH_CAP + 200; offset += 200) {
      seen.push(...(await search(g.chemist.agent, `q=gelatinous&limit=200&offset=${offset}`)).cases.map((c) => c.id));
    }
    expect(seen.sort()).toEqual(ids.slice(extra).sort());
  });

  it("counts exactly below the cap", async () => {
    const expected = ids.filter((_, i) => abandoned(i));
    const found = await search(g.chemist.agent, "q=gelatinous&status=abandoned&limit=200");
    expect(found).toMatchObject({ total: expected.length, totalIsLowerBound: false });
    expect(found.cases.map((c) => c.id).sort()).toEqual(expected.sort());
  });

  it("sorts every match when asked for another order, and exports them all", async () => {
    const oldest = await search(g.chemist.agent, "q=gelatinous&sort=occurredAt&order=asc&limit=3");
    expect(oldest.cases.map((c) => c.id)).toEqual(ids.slice(0, 3));
    expect(oldest).toMatchObject({ total: SEARCH_MATCH_CAP, totalIsLowerBound: true });
    const csv = await g.chemist.agent.get("/api/cases/export.csv?q=gelatinous");
    expect(csv.status).toBe(200);
    for (const id of ids) expect(csv.text).toContain(id);
  });

  it("keeps the plain list's total exact", async () => {
    expect(await search(g.chemist.agent, "limit=1")).toMatchObject({ total: n, totalIsLowerBound: false });
  });
});

describe("the typo vocabulary", () => {
  let g: Awaited<ReturnType<typeof groupWithRoles>>;
  beforeAll(async () => {
    g = await groupWithRoles(t, "vocab");
    await createCase(g.lead.agent, couplingCase({ notes: "Fine solids at the interface." }));
  });

  it("takes in a new case's words without reading the group again", async () => {
    const cache = new VocabularyCache(t.db);
    const before = await cache.get(g.groupId);
    expect(before.knows("zirconyl")).toBe(false);
    await createCase(g.chemist.agent, couplingCase({ title: "Zirconyl salts in the rag", notes: "Cloudy after the quench." }));
    const after = await cache.get(g.groupId);
    expect(after).toBe(before);
    expect(cache.fullReads).toBe(1);
    expect(after.knows("zirconyl")).toBe(true);
    expect(after.corrections("zirconly")).toContain("zirconyl");
  });

  it("corrects a slip in a word logged after the group's first search", async () => {
    expect((await search(g.chemist.agent, "q=hafnyl")).total).toBe(0);
    const c = await createCase(g.chemist.agent, couplingCase({ notes: "A hafnyl chloride residue held the band." }));
    // "hafnly": one swapped pair; six letters allow one slip.
    const found = await search(g.chemist.agent, "q=hafnly");
    expect(found.cases.map((x) => x.id)).toEqual([c.id]);
  });

  it("sees words written straight to the table", async () => {
    const c = await createCase(g.chemist.agent, couplingCase({ notes: "Nothing unusual." }));
    expect((await search(g.chemist.agent, "q=vanadiun")).total).toBe(0);
    await t.db.execute(sql`update cases set search_text = search_text || ' vanadium' where id = ${c.id}`);
    expect((await search(g.chemist.agent, "q=vanadiun")).cases.map((x) => x.id)).toEqual([c.id]);
  });

  it("sees a case logged through a second app on the same database", async () => {
    // On PostgreSQL the second app gets its own connection pool, as another server process would.
    const url = process.env.PHASEWISE_TEST_DATABASE_URL;
    const second: DatabaseHandle | null = url ? await openDatabase({ url }) : null;
    try {
      const db = second?.db ?? t.db;
      const { app } = createApp({
        db,
        dbKind: second?.kind ?? t.handle.kind,
        mail: createRecordingMailer(),
        baseURL: ORIGIN,
        rateLimit: { enabled: false },
        quiet: true,
        dataDir: `/tmp/phasewise-test-${process.pid}-second`,
      });
      const other = await signUp(app, "second-app");
      await db.execute(sql`insert into member (id, organization_id, user_id, role, created_at) values (${crypto.randomUUID()}, ${g.groupId}, ${other.userId}, 'chemist', now())`);
      expect((await search(g.chemist.agent, "q=niobyl")).total).toBe(0);
      const created = await createCase(other.agent, couplingCase({ notes: "A niobyl oxalate haze." }));
      // "nioybl": one swapped pair; six letters allow one slip.
      expect((await search(g.chemist.agent, "q=nioybl")).cases.map((x) => x.id)).toEqual([created.id]);
    } finally {
      await second?.close();
    }
  });
});

describe("vocabulary lookups", () => {
  // A vocabulary with near neighbours of every length, checked against edit distance over all of it.
  const words = ["emulsion", "emulsions", "emulsoin", "emission", "brine", "brines", "bring", "brain", "grain", "centrifuge", "centrifuged", "12345", "12354", "zeolite", "celite"];
  const vocab = new SearchVocabulary(words);

  it.each(["emulsoin", "emulsino", "brien", "centrifge", "12435", "celiet", "xyzzy"])("corrects %s to exactly the words within its allowance", (word) => {
    const allowed = word.length <= 4 ? 0 : word.length <= 7 ? 1 : 2;
    const expected = words.filter((w) => w !== word && editDistance(word, w) <= allowed).sort();
    expect(vocab.corrections(word, 100).sort()).toEqual(expected);
  });

  it("finds the same words as edit distance over the whole vocabulary, for slips of every kind", () => {
    // A seeded vocabulary of letters and digits, and queries made from its words by one or two random edits.
    let seed = 7;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const alphabet = "abcdefghij0123";
    const word = () => Array.from({ length: 3 + Math.floor(rnd() * 8) }, () => alphabet[Math.floor(rnd() * alphabet.length)]).join("");
    const many = Array.from({ length: 1500 }, word);
    const big = new SearchVocabulary(many);
    for (let q = 0; q < 150; q++) {
      let typed = many[Math.floor(rnd() * many.length)]!;
      for (let e = 0; e < 1 + Math.floor(rnd() * 2); e++) {
        const at = Math.floor(rnd() * typed.length);
        const c = alphabet[Math.floor(rnd() * alphabet.length)]!;
        const kind = Math.floor(rnd() * 4);
        typed =
          kind === 0 ? typed.slice(0, at) + c + typed.slice(at + 1)
          : kind === 1 ? typed.slice(0, at) + c + typed.slice(at)
          : kind === 2 ? typed.slice(0, at) + typed.slice(at + 1)
          : typed.slice(0, at) + (typed[at + 1] ?? "") + typed[at] + typed.slice(at + 2);
      }
      const allowed = typed.length <= 4 ? 0 : typed.length <= 7 ? 1 : 2;
      const expected = [...new Set(many)].filter((w) => w !== typed && editDistance(typed, w) <= allowed).sort();
      expect(big.corrections(typed, 10_000).sort()).toEqual(expected);
    }
  });

  it("knows words and the starts of words, and grows", () => {
    expect(vocab.knows("emuls")).toBe(true);
    expect(vocab.knows("brine")).toBe(true);
    expect(vocab.knows("brinx")).toBe(false);
    expect(vocab.add(["brinx", "brine", "not-a-word"])).toBe(1);
    expect(vocab.knows("brinx")).toBe(true);
    expect(vocab.knows("not")).toBe(false);
  });
});
