import type { CreateCaseBody } from "../../knowledge/contracts/cases";
import { median, type InsightResponse } from "../../knowledge/contracts/insight";
import { insightPeriod, monthsBetween } from "../../server/insight";
import { agentFor, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { createCase } from "./case-helpers";

/*
 * A quarter of our fictional group's work-ups, January to March 2025, counted by hand below.
 * Every expected number in this file comes from the table in the comments, not from the code.
 */
type Attempts = CreateCaseBody["attempts"];
const naoh = { solute: "NaOH", concentration: { value: 1, unit: "mol/L" as const }, volumeMl: 50 };
const water = { solute: "water", volumeMl: 50 };
const logged = (title: string, occurredAt: string, status: "open" | "resolved" | "abandoned", organic: { solvent: string; volumeMl: number }[], aqueous: CreateCaseBody["system"]["aqueous"], attempts: Attempts): CreateCaseBody => ({
  title,
  occurredAt: `${occurredAt}T10:00:00Z`,
  status,
  system: { organic, aqueous, temperatureC: 20 },
  attempts,
});
const dcm = [{ solvent: "DCM", volumeMl: 50 }];

let t: TestApp;
let g: Awaited<ReturnType<typeof groupWithRoles>>;
let stubbornId: string;

beforeAll(async () => {
  t = await startTestApp();
  g = await groupWithRoles(t, "insight");
  const other = await groupWithRoles(t, "insight-other");
  const c = g.chemist.agent;
  // C1 halogenated, resolved: stand 20 min no change, pad 15 min cleared → 35 min to clear
  await createCase(c, logged("Case C1", "2025-01-10", "resolved", dcm, naoh, [
    { remedyId: "let-stand", minutes: 20, outcome: "no-change" },
    { remedyId: "filter-pad", minutes: 15, outcome: "cleared" },
  ]));
  // C2 halogenated, resolved: brine 10 min cleared → 10 min
  await createCase(c, logged("Case C2", "2025-01-20", "resolved", dcm, naoh, [{ remedyId: "saturated-brine", minutes: 10, outcome: "cleared" }]));
  // C3 ester, resolved: brine 5 min partly, brine 10 min cleared → 15 min
  await createCase(c, logged("Case C3", "2025-02-05", "resolved", [{ solvent: "ethyl acetate", volumeMl: 50 }], water, [
    { remedyId: "saturated-brine", minutes: 5, outcome: "partly" },
    { remedyId: "saturated-brine", minutes: 10, outcome: "cleared" },
  ]));
  // C4 ester (ethyl acetate is the main solvent), open, two attempts, none cleared → stubborn
  const stubborn = await createCase(c, logged("C4 stubborn", "2025-02-14", "open", [{ solvent: "ethyl acetate", volumeMl: 80 }, { solvent: "methanol", volumeMl: 10 }], water, [
    { remedyId: "saturated-brine", outcome: "no-change" },
    { remedyId: "centrifuge", minutes: 30, outcome: "worse" },
  ]));
  stubbornId = stubborn.id;
  // C5 halogenated, open, one attempt → not stubborn yet
  await createCase(c, logged("Case C5", "2025-03-03", "open", dcm, naoh, [{ remedyId: "filter-pad", minutes: 20, outcome: "no-change" }]));
  // C6 aromatic, abandoned
  await createCase(c, logged("Case C6", "2025-03-20", "abandoned", [{ solvent: "toluene", volumeMl: 50 }], water, [
    { remedyId: "ultrasound", minutes: 10, outcome: "no-change" },
    { remedyId: "let-stand", minutes: 60, outcome: "no-change" },
  ]));
  // C7 halogenated, resolved: an untimed stand, then the pad 12 min cleared → left out of the median
  await createCase(c, logged("Case C7", "2025-03-25", "resolved", dcm, naoh, [
    { remedyId: "let-stand", outcome: "no-change" },
    { remedyId: "filter-pad", minutes: 12, outcome: "cleared" },
  ]));
  // Outside the period, retired, or another group's: none of these count.
  await createCase(c, logged("Before", "2024-12-30", "resolved", dcm, water, [{ remedyId: "filter-pad", minutes: 5, outcome: "cleared" }]));
  const retired = await createCase(c, logged("Retired", "2025-02-10", "resolved", dcm, naoh, [{ remedyId: "filter-pad", minutes: 5, outcome: "cleared" }]));
  await g.lead.agent.post(`/api/cases/${retired.id}/retire`).send({ code: "duplicate", reason: "Logged twice." }).expect(200);
  await createCase(other.chemist.agent, logged("Theirs", "2025-02-10", "open", dcm, naoh, [
    { remedyId: "filter-pad", outcome: "no-change" },
    { remedyId: "centrifuge", outcome: "no-change" },
  ]));
});
afterAll(async () => {
  await t.close();
});

describe("GET /api/insight", () => {
  let r: InsightResponse;
  beforeAll(async () => {
    const res = await g.chemist.agent.get("/api/insight?from=2025-01-01&to=2025-03-31");
    expect(res.status).toBe(200);
    r = res.body;
  });

  it("counts the period's live cases", () => {
    expect(r.period).toEqual({ from: "2025-01-01", to: "2025-03-31" });
    // C1–C7; open C4, C5; resolved C1, C2, C3, C7; abandoned C6; attempts 2+1+2+2+1+2+2
    expect(r.totals).toEqual({ cases: 7, open: 2, resolved: 4, abandoned: 1, attempts: 12 });
  });

  it("gives each remedy's success rate by system family", () => {
    expect(r.byFamily.map((f) => [f.solventFamily, f.tried])).toEqual([
      ["halogenated", 6],
      ["ester", 4],
      ["aromatic", 2],
    ]);
    const hal = r.byFamily[0]!.remedies.map((x) => [x.remedyId, x.tried, x.cleared, x.partly]);
    // pad: C1 cleared, C5 no change, C7 cleared; stand: C1, C7 no change; brine: C2 cleared
    expect(hal).toEqual([
      ["filter-pad", 3, 2, 0],
      ["let-stand", 2, 0, 0],
      ["saturated-brine", 1, 1, 0],
    ]);
    // 2 of 3 = 0.6667, to 3 decimals
    expect(r.byFamily[0]!.remedies[0]!.rate).toBe(0.667);
    // brine on esters: C3 partly, C3 cleared, C4 no change; centrifuge: C4 worse
    expect(r.byFamily[1]!.remedies.map((x) => [x.remedyId, x.tried, x.cleared, x.partly])).toEqual([
      ["saturated-brine", 3, 1, 1],
      ["centrifuge", 1, 0, 0],
    ]);
  });

  it("gives the median time to clear, leaving out cases with an untimed attempt", () => {
    // cleared cases: C1 35, C2 10, C3 15 (C7 untimed) → median of 10, 15, 35 = 15
    expect(r.timeToClear).toMatchObject({ medianMinutes: 15, cases: 3, untimed: 1 });
    // the clearing attempt alone: brine C2 10, C3 10 → 10; pad C1 15, C7 12 → (12 + 15) / 2 = 13.5
    expect(r.timeToClear.byRemedy.map((x) => [x.remedyId, x.medianMinutes, x.cases])).toEqual([
      ["saturated-brine", 10, 2],
      ["filter-pad", 13.5, 2],
    ]);
  });

  it("lists stubborn open cases, the solvents used most and cases per month", () => {
    expect(r.stubborn.map((s) => [s.id, s.attempts])).toEqual([[stubbornId, 2]]);
    expect(r.stubborn[0]!.solvents).toEqual(["Ethyl acetate", "Methanol"]);
    // DCM: C1, C2, C5, C7; ethyl acetate: C3, C4; methanol: C4; toluene: C6
    expect(r.solvents.map((s) => [s.key, s.cases])).toEqual([
      ["dichloromethane", 4],
      ["ethyl-acetate", 2],
      ["methanol", 1],
      ["toluene", 1],
    ]);
    // January C1, C2 (both resolved); February C3 (resolved), C4; March C5, C6, C7 (C7 resolved)
    expect(r.perMonth).toEqual([
      { month: "2025-01", cases: 2, resolved: 2 },
      { month: "2025-02", cases: 2, resolved: 1 },
      { month: "2025-03", cases: 3, resolved: 1 },
    ]);
  });

  it("narrows to the period asked for, both ends inclusive", async () => {
    const feb = (await g.lead.agent.get("/api/insight?from=2025-02-05&to=2025-02-14")).body as InsightResponse;
    expect(feb.totals.cases).toBe(2); // C3 on the 5th, C4 on the 14th
    expect(feb.perMonth).toEqual([{ month: "2025-02", cases: 2, resolved: 1 }]);
  });

  it("answers any member of the group, and validates the period", async () => {
    expect((await agentFor(t.app).get("/api/insight")).status).toBe(401);
    expect((await g.owner.agent.get("/api/insight")).status).toBe(200);
    const backwards = await g.chemist.agent.get("/api/insight?from=2025-03-01&to=2025-01-01");
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.from).toMatch(/after the end/);
    expect((await g.chemist.agent.get("/api/insight?from=March")).status).toBe(400);
  });
});

describe("period and median helpers", () => {
  it("defaults to the last 12 calendar months up to today", () => {
    expect(insightPeriod({}, new Date("2025-03-15T12:00:00Z"))).toEqual({ from: "2024-04-01", to: "2025-03-15" });
    expect(monthsBetween("2024-04-01", "2025-03-15")).toHaveLength(12);
    expect(monthsBetween("2024-11-20", "2025-02-01")).toEqual(["2024-11", "2024-12", "2025-01", "2025-02"]);
  });

  it.each([
    [[], null],
    [[7], 7],
    [[35, 10, 15], 15],
    [[15, 12], 13.5],
    [[4, 1, 3, 2], 2.5],
  ])("median(%j) = %p", (values, expected) => {
    expect(median(values)).toBe(expected);
  });
});
