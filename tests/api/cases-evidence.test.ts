import { sql } from "drizzle-orm";
import { remedyEvidence, type EvidenceRecord } from "../../knowledge/emulsion/evidence";
import { groupEvidence } from "../../server/case-evidence";
import { groupWithRoles, startTestApp, type TestApp } from "./harness";
import { couplingCase, createCase, fixtureCases } from "./case-helpers";

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;
const fixture = fixtureCases(20);
const caseIds: string[] = [];

/** Solvent families from the reference table; pH bands worked out by hand as in case-search.test.ts. */
const FAMILY: Record<string, string> = {
  dichloromethane: "halogenated",
  "ethyl-acetate": "ester",
  toluene: "aromatic",
  mtbe: "ether",
  "2-methyltetrahydrofuran": "ether",
};
const BAND: Record<string, string> = {
  "sodium-bicarbonate": "6-9",
  "sodium-chloride": "6-9",
  water: "6-9",
  "ammonium-chloride": "2-6",
  "hydrochloric-acid": "<2",
  "sodium-hydroxide": ">12",
};

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "evidence");
  b = await groupWithRoles(t, "foreign");
  for (const f of fixture) caseIds.push((await createCase(a.chemist.agent, f.body)).id);
  // Left out: a retired case, a free-text attempt, a case whose aqueous phase the tables lack, and another group.
  await t.db.execute(sql`update cases set retired = true where id = ${caseIds[7]!}`);
  await createCase(a.chemist.agent, couplingCase({ attempts: [{ description: "Stood it in the fridge overnight", outcome: "cleared" }] }));
  await createCase(
    a.chemist.agent,
    couplingCase({ system: { organic: [{ solvent: "MTBE", volumeMl: 100 }], aqueous: { solute: "Rochelle salt", volumeMl: 80 } }, attempts: [{ remedyId: "tartrate-chelation", outcome: "cleared" }] }),
  );
  await createCase(b.owner.agent, couplingCase({ attempts: [{ remedyId: "filter-pad", outcome: "cleared" }] }));
}, 60_000);
afterAll(async () => {
  await t.close();
});

describe("groupEvidence", () => {
  it("returns one record per catalogued attempt in the group's live cases", async () => {
    const records = await groupEvidence(t.db, a.groupId);
    const expected: EvidenceRecord[] = fixture
      .filter((f) => f.i !== 7)
      .map((f) => ({
        groupId: a.groupId,
        remedyId: f.remedy,
        outcome: f.outcome,
        solventFamily: FAMILY[f.solvent.key]!,
        phBand: BAND[f.aqueous.key]!,
        causeCode: f.i % 2 === 0 ? "fine-solids" : "surfactant-soap",
      }));
    const key = (r: EvidenceRecord) => JSON.stringify([r.remedyId, r.outcome, r.solventFamily, r.phBand, r.causeCode]);
    expect(records.map(key).sort()).toEqual(expected.map(key).sort());
    expect(records.every((r) => r.groupId === a.groupId)).toBe(true);
  });

  it("feeds the emulsion ranking's evidence count for a signature", async () => {
    const records = await groupEvidence(t.db, a.groupId);
    // Halogenated over a 6–9 aqueous phase with fine solids: DCM names are i mod 8 ∈ {0,1,2}, the 6–9 phases
    // i mod 6 ∈ {0,1,4}, fine solids even i → cases 0, 10, 16, 18. Remedies cycle i mod 5 (0, 10 → brine;
    // 16 → filter pad; 18 → solid salt), outcomes i mod 4 (0, 16 → cleared; 10, 18 → no change).
    const sig = { solventFamily: "halogenated", phBand: "6-9" as const, causeCode: "fine-solids" };
    expect(remedyEvidence("saturated-brine", 0.5, records, sig)).toMatchObject({ cleared: 1, tried: 2 });
    expect(remedyEvidence("filter-pad", 0.5, records, sig)).toMatchObject({ cleared: 1, tried: 1 });
    expect(remedyEvidence("solid-salt", 0.5, records, sig)).toMatchObject({ cleared: 0, tried: 1 });
    expect(remedyEvidence("centrifuge", 0.5, records, sig)).toBeNull();
  });

  it("keeps groups apart", async () => {
    const theirs = await groupEvidence(t.db, b.groupId);
    expect(theirs).toEqual([{ groupId: b.groupId, remedyId: "filter-pad", outcome: "cleared", solventFamily: "halogenated", phBand: "6-9", causeCode: "fine-solids" }]);
  });
});
