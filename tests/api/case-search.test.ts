import { sql } from "drizzle-orm";
import { groupWithRoles, startTestApp, type Agent, type TestApp } from "./harness";
import { createCase, fixtureCases, type FixtureCase } from "./case-helpers";

/*
 * Search and filters over a fixture of 60 cases in one group and 8 in another. Every expected
 * set is worked out from the fixture's own table, not from the server.
 */

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;
const fixture = fixtureCases(60);
const ids = new Map<number, string>();
const bIds: string[] = [];

/** pH bands worked out by hand: saturated NaHCO3 (6.35 + 10.33) / 2 = 8.3; NaCl and water 7.0; saturated NH4Cl ≈ 4.3 (pKa 9.25, ~5.5 mol/L); 1 M HCl 0; 1 M NaOH 14. */
const BAND: Record<string, string> = {
  "sodium-bicarbonate": "6-9",
  "sodium-chloride": "6-9",
  water: "6-9",
  "ammonium-chloride": "2-6",
  "hydrochloric-acid": "<2",
  "sodium-hydroxide": ">12",
};

async function search(agent: Agent, query: string): Promise<{ ids: string[]; total: number; cases: Record<string, unknown>[] }> {
  const res = await agent.get(`/api/cases?limit=200&${query}`);
  if (res.status !== 200) throw new Error(`${res.status} ${res.text}`);
  return { ids: res.body.cases.map((c: { id: string }) => c.id), total: res.body.total, cases: res.body.cases };
}
const idsOf = (rows: FixtureCase[]) => rows.map((f) => ids.get(f.i)!).sort();
const live = (f: FixtureCase) => f.i !== 5; // case 5 is retired below

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "search");
  b = await groupWithRoles(t, "rival");
  for (const f of fixture) {
    const author = f.i % 2 === 1 ? a.chemist : a.lead;
    ids.set(f.i, (await createCase(author.agent, f.body)).id);
  }
  for (const f of fixtureCases(8, "rival ")) bIds.push((await createCase(b.owner.agent, f.body)).id);
  await t.db.execute(sql`update cases set verified = true, verified_by = ${a.lead.userId}, verified_at = now() where id in (${ids.get(3)!}, ${ids.get(4)!})`);
  await t.db.execute(sql`update cases set retired = true, retired_reason = 'duplicate' where id = ${ids.get(5)!}`);
}, 120_000);
afterAll(async () => {
  await t.close();
});

describe("the search box", () => {
  const dcm = fixture.filter((f) => f.solvent.key === "dichloromethane" && live(f));

  it.each(["DCM", "methylene chloride", "dichloromethane", "CH2Cl2", "dichlormethane"])("finds every dichloromethane case by %s, however it was logged", async (q) => {
    expect(dcm.length).toBeGreaterThan(15);
    const found = await search(a.chemist.agent, `q=${encodeURIComponent(q)}`);
    expect(found.ids.sort()).toEqual(idsOf(dcm));
    expect(found.total).toBe(dcm.length);
  });

  it("finds an aqueous phase by a synonym, and the word anywhere else (bicarb → NaHCO3 cases and a bicarbonate title)", async () => {
    const expected = fixture.filter((f) => live(f) && (f.aqueous.key === "sodium-bicarbonate" || f.title.includes("bicarbonate")));
    expect((await search(a.chemist.agent, "q=bicarb")).ids.sort()).toEqual(idsOf(expected));
  });

  it("finds remedies tried (brine: brine as the aqueous phase or saturated brine as a remedy)", async () => {
    const expected = fixture.filter((f) => live(f) && (f.aqueous.key === "sodium-chloride" || f.remedy === "saturated-brine"));
    expect((await search(a.chemist.agent, "q=brine")).ids.sort()).toEqual(idsOf(expected));
  });

  it("forgives a typing slip in a note word (emulsoin → emulsion)", async () => {
    const expected = fixture.filter((f) => live(f) && f.saysEmulsion);
    expect(expected.length).toBeGreaterThan(5);
    expect((await search(a.chemist.agent, "q=emulsoin")).ids.sort()).toEqual(idsOf(expected));
  });

  it("finds tags and combines words with AND", async () => {
    const tagged = fixture.filter((f) => live(f) && f.phaseTransfer);
    expect((await search(a.chemist.agent, "q=phase-transfer")).ids.sort()).toEqual(idsOf(tagged));
    const dcmRag = dcm.filter((f) => f.title.startsWith("Rag layer"));
    expect(dcmRag.length).toBeGreaterThan(0);
    expect((await search(a.chemist.agent, "q=DCM%20rag")).ids.sort()).toEqual(idsOf(dcmRag));
  });

  it("ranks a title match above a notes match", async () => {
    const found = await search(a.chemist.agent, "q=hazy");
    const hazy = fixture.filter((f) => live(f) && f.title.startsWith("Hazy"));
    expect(found.ids.slice(0, hazy.length).sort()).toEqual(idsOf(hazy));
  });

  it("shows what worked on each result", async () => {
    const found = await search(a.chemist.agent, "q=DCM");
    for (const f of dcm) {
      const row = found.cases.find((c) => c.id === ids.get(f.i))!;
      const expected =
        f.outcome === "cleared"
          ? { "saturated-brine": "cleared with saturated brine after 10 min", "filter-pad": "cleared by filtering through diatomaceous earth after 10 min", "let-stand": "cleared on standing after 10 min", "solid-salt": "cleared with solid salt after 10 min", "adjust-ph": "cleared by adjusting the pH after 10 min" }[f.remedy]
          : f.outcome === "partly"
            ? { "saturated-brine": "partly cleared with saturated brine after 10 min", "filter-pad": "partly cleared by filtering through diatomaceous earth after 10 min", "let-stand": "partly cleared on standing after 10 min", "solid-salt": "partly cleared with solid salt after 10 min", "adjust-ph": "partly cleared by adjusting the pH after 10 min" }[f.remedy]
            : null;
      expect(row.whatWorked).toBe(expected);
    }
  });
});

describe("filters", () => {
  it("combine with each other and with the search box", async () => {
    const expected = fixture.filter(
      (f) => live(f) && f.solvent.key === "dichloromethane" && f.status === "open" && f.remedy === "saturated-brine" && f.outcome === "cleared",
    );
    expect(expected.length).toBeGreaterThan(0);
    const found = await search(a.chemist.agent, "solvent=methylene%20chloride&status=open&remedy=saturated-brine&outcome=cleared");
    expect(found.ids.sort()).toEqual(idsOf(expected));
    const withQ = fixture.filter((f) => live(f) && f.aqueous.key === "sodium-bicarbonate" && f.status === "resolved");
    expect((await search(a.chemist.agent, "q=bicarbonate&aqueous=bicarb&status=resolved")).ids.sort()).toEqual(idsOf(withQ));
  });

  it.each([
    ["aqueous=NH4Cl", (f: FixtureCase) => f.aqueous.key === "ammonium-chloride"],
    ["cause=surfactant-soap", (f: FixtureCase) => f.i % 2 === 1],
    ["outcome=worse", (f: FixtureCase) => f.outcome === "worse"],
    ["remedy=filter-pad", (f: FixtureCase) => f.remedy === "filter-pad"],
    ["status=abandoned", (f: FixtureCase) => f.status === "abandoned"],
    ["solvent=EtOAc&cause=fine-solids", (f: FixtureCase) => f.solvent.key === "ethyl-acetate" && f.i % 2 === 0],
    // Day 1 + i of January 2025 at 14:30 UTC; a bare "to" date includes its whole day.
    ["from=2025-01-10&to=2025-01-20", (f: FixtureCase) => f.i >= 9 && f.i <= 19],
  ])("%s", async (query, pick) => {
    const expected = fixture.filter((f) => live(f) && pick(f));
    expect(expected.length).toBeGreaterThan(0);
    expect((await search(a.chemist.agent, query)).ids.sort()).toEqual(idsOf(expected));
  });

  it("author=me, verified, and retired cases on request", async () => {
    const mine = fixture.filter((f) => live(f) && f.i % 2 === 1);
    expect((await search(a.chemist.agent, "author=me")).ids.sort()).toEqual(idsOf(mine));
    expect((await search(a.chemist.agent, `author=${a.lead.userId}`)).total).toBe(fixture.filter((f) => live(f) && f.i % 2 === 0).length);
    expect((await search(a.chemist.agent, "verified=true")).ids.sort()).toEqual([ids.get(3)!, ids.get(4)!].sort());
    expect((await search(a.chemist.agent, "verified=false")).total).toBe(fixture.length - 3);
    expect((await search(a.chemist.agent, "")).ids).not.toContain(ids.get(5));
    expect((await search(a.chemist.agent, "includeRetired=true")).ids).toContain(ids.get(5));
  });

  it("pages and sorts", async () => {
    const res = await a.chemist.agent.get("/api/cases?limit=10&offset=10&sort=occurredAt&order=asc");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: fixture.length - 1, limit: 10, offset: 10 });
    // Oldest first, skipping ten (case 5 is retired): cases 11…20.
    expect(res.body.cases.map((c: { id: string }) => c.id)).toEqual(fixture.slice(11, 21).map((f) => ids.get(f.i)));
    const byTitle = await search(a.chemist.agent, "sort=title");
    const order = ["Foam", "Hazy", "Milky", "Rag", "Third"];
    const firstWords = byTitle.cases.map((c) => order.indexOf(String(c.title).split(" ")[0]!));
    expect(firstWords).toEqual([...firstWords].sort((x, y) => x - y));
  });

  it("answers 400 for an unknown solvent, with suggestions", async () => {
    const res = await a.chemist.agent.get("/api/cases?solvent=dichlorox");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("solvent");
    expect((await a.chemist.agent.get("/api/cases?from=2025-02-01&to=2025-01-01")).status).toBe(400);
    expect((await a.chemist.agent.get("/api/cases?verified=maybe")).status).toBe(400);
  });

  it("remedy and outcome together mean the same attempt", async () => {
    const c = await createCase(a.lead.agent, {
      ...fixture[0]!.body,
      title: "Two tries",
      attempts: [
        { remedyId: "saturated-brine", outcome: "no-change" },
        { remedyId: "filter-pad", outcome: "cleared" },
      ],
    });
    expect((await search(a.chemist.agent, "remedy=saturated-brine&outcome=cleared")).ids).not.toContain(c.id);
    expect((await search(a.chemist.agent, "remedy=filter-pad&outcome=cleared")).ids).toContain(c.id);
    await t.db.execute(sql`update cases set retired = true where id = ${c.id}`);
  });
});

describe("groups stay apart", () => {
  it("never shows another group's cases, in results, totals or similar cases", async () => {
    for (const q of ["q=DCM", "q=rival", "q=bicarb", "solvent=DCM", ""]) {
      const found = await search(a.chemist.agent, q);
      expect(found.ids.filter((id) => bIds.includes(id))).toEqual([]);
    }
    expect((await search(a.chemist.agent, "q=rival")).total).toBe(0);
    const theirs = await search(b.owner.agent, "q=DCM");
    expect(theirs.ids.every((id) => bIds.includes(id))).toBe(true);
    // Rival cases 0–2 are the dichloromethane ones (cycle of eight solvents).
    expect(theirs.total).toBe(3);
  });

  it("lists similar cases: same solvent family and pH band, sharing a cause or the emulsion kind", async () => {
    const first = fixture[0]!; // DCM over saturated NaHCO3, fine solids, rag with solids
    const detail = (await a.chemist.agent.get(`/api/cases/${ids.get(0)}`)).body;
    const eligible = fixture.filter(
      (f) =>
        f.i !== 0 &&
        live(f) &&
        f.solvent.key === "dichloromethane" &&
        BAND[f.aqueous.key] === BAND[first.aqueous.key] &&
        (f.i % 2 === 0 || f.i % 5 === 0),
    );
    expect(eligible.length).toBeGreaterThanOrEqual(5);
    const similarIds = detail.similar.map((s: { id: string }) => s.id);
    expect(similarIds).toHaveLength(5);
    for (const id of similarIds) expect(idsOf(eligible)).toContain(id);
    expect(similarIds.some((id: string) => bIds.includes(id))).toBe(false);
    for (const s of detail.similar) {
      expect(s).toMatchObject({ solventFamily: "halogenated", phBand: "6-9" });
      expect(s.matched).toEqual(expect.arrayContaining(["solvent family", "pH band"]));
    }
  });
});
