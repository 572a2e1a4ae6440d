import request from "supertest";
import { sql } from "drizzle-orm";
import { groupWithRoles, signUp, startTestApp, type TestApp } from "./harness";

/*
 * POST /api/plans/compute and the saved plans, checked against formulas worked by hand:
 *  - Henderson–Hasselbalch: fraction neutral of a base = 1 / (1 + 10^(pKa − pH)), of an acid 1 / (1 + 10^(pH − pKa)).
 *  - One pass (Nichols, Organic Chemistry Laboratory Techniques, ch. 4): fraction left in the
 *    organic layer = D·V_org / (D·V_org + V_aq); n fresh passes multiply.
 *  - Strong acid: pH = −log[H⁺]; an amphiprotic salt (NaHCO3): pH ≈ (pKa1 + pKa2)/2 = (6.35 + 10.33)/2
 *    (CRC, dissociation constants of inorganic acids).
 *  - Ideal gas: V = nRT/P, R = 8.314 462 618 J/(mol·K) (SI 2019), 1 atm = 101 325 Pa.
 *  - Funnel: smallest standard size filled at most three-quarters (common practice).
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const M = (value: number) => ({ value, unit: "mol/L" });
const baseHH = (pKa: number, pH: number) => 1 / (1 + 10 ** (pKa - pH));
const acidHH = (pKa: number, pH: number) => 1 / (1 + 10 ** (pH - pKa));
const onePass = (D: number, vOrg: number, vAq: number) => (D * vOrg) / (D * vOrg + vAq);
/** relative closeness, for fractions that run down to 1e-15 */
const rel = (actual: number, expected: number, tol = 1e-6) => expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(tol);

const issueExample = {
  organic: { solvent: "ethyl acetate", volumeMl: 50 },
  components: [{ name: "amine A", kind: "base", pKa: 9.5, partitionCoefficient: 40, amountMmol: 4 }],
  washes: [{ aqueous: { solute: "HCl", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 20, repeats: 2 }],
  temperatureC: 20,
};

// A fictional Larchmere work-up: 6 mmol of a neutral ketone, 2.5 mmol of an aryl amine side
// product and 1.5 mmol of a carboxylic acid left from the coupling, in 60 mL ethyl acetate.
const threeWashes = {
  organic: { solvent: "EtOAc", volumeMl: 60 },
  components: [
    { name: "tolyl amine", kind: "base", pKa: 9.3, partitionCoefficient: 30, amountMmol: 2.5 },
    { name: "heptanoic acid", kind: "acid", pKa: 4.9, partitionCoefficient: 200, amountMmol: 1.5 },
    { name: "ketone product", kind: "neutral", partitionCoefficient: 8, amountMmol: 6 },
  ],
  washes: [
    { aqueous: { solute: "HCl", concentration: M(1) }, volumeMl: 25, repeats: 2 },
    { aqueous: { solute: "sat. NaHCO3", concentration: "saturated" }, volumeMl: 25, repeats: 2 },
    { aqueous: { solute: "brine", concentration: "saturated" }, volumeMl: 25 },
  ],
  temperatureC: 20,
};

const compute = (body: unknown) => request(t.app).post("/api/plans/compute").send(body as object);

describe("POST /api/plans/compute", () => {
  it("answers the issue's example without signing in, pass by pass, against Henderson–Hasselbalch and the one-pass formula", async () => {
    const res = await compute(issueExample);
    expect(res.status).toBe(200);
    const b = res.body;
    expect(b.steps.map((s: { wash: number; pass: number }) => [s.wash, s.pass])).toEqual([
      [0, 1],
      [0, 2],
    ]);
    // pass 1: 20 mmol H⁺ in 20 mL, 4 mmol taken by the amine → [H⁺] = 16/20 M
    const pH1 = -Math.log10(16 / 20);
    expect(b.steps[0].aqueousPh).toBeCloseTo(pH1, 3);
    const left1 = onePass(40 * baseHH(9.5, pH1), 50, 20);
    rel(b.steps[0].components[0].fractionInOrganic, left1, 1e-3);
    // pass 2: fresh 1 M HCl, pH 0
    expect(b.steps[1].aqueousPh).toBeCloseTo(0, 3);
    rel(b.steps[1].components[0].fractionInOrganic, left1 * onePass(40 * baseHH(9.5, 0), 50, 20), 1e-3);
    rel(b.final.components[0].fractionInOrganic, b.steps[1].components[0].fractionInOrganic, 1e-12);
    // EtOAc (0.900 g/mL, CRC) floats on 1 M HCl (≈ 1.016 g/mL, CRC)
    expect(b.steps.every((s: { top: string }) => s.top === "organic")).toBe(true);
    expect(b.funnelMl).toBe(125); // 70 mL: 60 mL funnel holds 45 mL at ¾, 125 mL holds 93.75
    expect(b.warnings.map((w: { code: string }) => w.code)).toContain("partial-miscibility");
    expect(b.sourceTitles.map((s: { key: string }) => s.key)).toEqual(b.sources);
    expect(b.sourceTitles.find((s: { key: string }) => s.key === "crc-inorganic-dissociation").title).toMatch(/CRC Handbook/);
  });

  it("tracks three components through 1 M HCl ×2, saturated bicarbonate ×2 and brine", async () => {
    const res = await compute(threeWashes);
    expect(res.status).toBe(200);
    const { steps, final } = res.body;
    expect(steps.map((s: { wash: number; pass: number }) => `${s.wash}.${s.pass}`)).toEqual(["0.1", "0.2", "1.1", "1.2", "2.1"]);
    const frac = (i: number, name: string) => steps[i].components.find((c: { name: string }) => c.name === name).fractionInOrganic;
    // neutral: (D·V_org / (D·V_org + V_aq))ⁿ with D = K = 8 at every pass
    const f = onePass(8, 60, 25);
    for (let n = 1; n <= 5; n++) rel(frac(n - 1, "ketone product"), f ** n, 1e-9);
    // the amine leaves with the first acid pass; 25 mmol H⁺ − 2.5 taken → pH = −log(22.5/25)
    const pH1 = -Math.log10(22.5 / 25);
    expect(steps[0].aqueousPh).toBeCloseTo(pH1, 3);
    rel(frac(0, "tolyl amine"), onePass(30 * baseHH(9.3, pH1), 60, 25), 1e-3);
    // the acid stays through the acid passes (fraction neutral ≈ 1 at pH ≈ 0)
    rel(frac(1, "heptanoic acid"), onePass(200 * acidHH(4.9, pH1), 60, 25) * onePass(200 * acidHH(4.9, 0), 60, 25), 1e-3);
    // bicarbonate: the fresh wash sits at (pKa1 + pKa2)/2
    expect(steps[2].washPh).toBeCloseTo((6.35 + 10.33) / 2, 1);
    // and takes the acid at its own pass pH by Henderson–Hasselbalch; K = 200 is greasy, so one
    // pass near pH 7.7 leaves D = 200·10^(4.9 − 7.7) ≈ 0.3 and about 40 % behind: the second pass is needed
    for (const i of [2, 3]) rel(frac(i, "heptanoic acid"), frac(i - 1, "heptanoic acid") * onePass(200 * acidHH(4.9, steps[i].aqueousPh), 60, 25), 1e-6);
    expect(frac(2, "heptanoic acid")).toBeGreaterThan(0.3);
    expect(frac(3, "heptanoic acid")).toBeLessThan(0.2);
    // CO2 volume is n·RT/P at 20 °C: 24.055 mL per mmol
    const mlPerMmol = ((8.314462618 * 293.15) / 101325) * 1e6 / 1000;
    expect(steps[2].co2Ml).toBeCloseTo(steps[2].co2Mmol * mlPerMmol, 6);
    expect(steps[2].co2Mmol).toBeGreaterThan(0.5);
    // brine is neutral
    expect(steps[4].washPh).toBeCloseTo(7.0, 1);
    // a wash "removed" a component when it took ≥ 5 % of the start: the ketone loses 1 − f² to each
    // two-pass wash (9.7 %, then 8.7 %) but only f⁴(1 − f) = 4.0 % to the brine
    expect(1 - f ** 2).toBeGreaterThan(0.05);
    expect(f ** 4 * (1 - f)).toBeLessThan(0.05);
    expect(final.components.map((c: { name: string; removedBy: number[] }) => [c.name, c.removedBy])).toEqual([
      ["tolyl amine", [0]],
      ["heptanoic acid", [1]],
      ["ketone product", [0, 1]],
    ]);
    expect(res.body.funnelMl).toBe(125); // 85 mL ≤ 93.75 mL
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain("co2-gas");
  });

  it("puts dichloromethane below the washes", async () => {
    const res = await compute({ ...issueExample, organic: { solvent: "DCM", volumeMl: 50 } });
    expect(res.status).toBe(200);
    expect(res.body.steps.every((s: { top: string; bottom: string }) => s.top === "aqueous" && s.bottom === "organic")).toBe(true);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain("halogenated");
  });

  it("says when a wash holds too little acid, and limits the transfer to what it holds", async () => {
    const res = await compute({ ...issueExample, washes: [{ aqueous: { solute: "HCl", concentration: M(1) }, volumeMl: 2 }] });
    expect(res.status).toBe(200);
    expect(res.body.steps[0].capacityExceeded).toBe(true);
    const removedMmol = 4 * (1 - res.body.steps[0].components[0].fractionInOrganic);
    expect(removedMmol).toBeLessThan(2.01); // 2 mL × 1 M = 2 mmol of acid, plus a trace of free amine
    expect(res.body.warnings.find((w: { code: string }) => w.code === "wash-capacity").message).toMatch(/holds 2\.00 mmol of acid but the bases need 4\.00 mmol/);
  });

  it("recovers the amine from the combined HCl extracts with 2 M NaOH: the mmol and mL of a hand charge balance, and the exotherm", async () => {
    const res = await compute({ ...issueExample, recovery: { component: "amine A", reagent: { solute: "NaOH", concentration: M(2) } } });
    expect(res.status).toBe(200);
    const r = res.body.recovery;
    expect(r.wash).toBe(0);
    expect(r.extractVolumeMl).toBe(40);
    expect(r.targetPh).toBeCloseTo(11.5, 9); // pKa + 2
    // charge balance at pH 11.5: Na⁺ = Cl⁻ − BH⁺ − H⁺ + OH⁻ with 40 mmol Cl⁻, 4 mmol amine (1 % protonated)
    const protonatedMmol = 4 / (1 + 10 ** (11.5 - 9.5));
    let n = 40;
    for (let i = 0; i < 20; i++) n = 40 - protonatedMmol + 10 ** -2.5 * (40 + n / 2);
    expect(r.reagentMmol).toBeCloseTo(n, 1);
    expect(r.reagentVolumeMl).toBeCloseTo(n / 2, 1);
    // heat: 36 mmol free H⁺ (0.9 M in 40 mL) meet OH⁻ at −55.8 kJ/mol (CODATA); about 60 g of water-like liquid
    expect(r.waterFormedMmol).toBeCloseTo(36, 1);
    expect(r.heatJ).toBeCloseTo(0.036 * 55800, -1);
    const riseByHand = (0.036 * 55800) / ((40 * 1.016 + 20.1 * 1.08) * 4.18); // densities of 1 M HCl and 2 M NaOH, CRC
    expect(r.temperatureRiseK).toBeCloseTo(riseByHand, 0);
    expect(r.warnings.map((w: { code: string }) => w.code)).toContain("exotherm");
  });

  it("recovers the acid from the bicarbonate extract with 6 M HCl and counts the CO2 at nRT/P", async () => {
    const res = await compute({ ...threeWashes, recovery: { component: "heptanoic acid", reagent: { solute: "HCl", concentration: M(6) } } });
    expect(res.status).toBe(200);
    const r = res.body.recovery;
    expect(r.wash).toBe(1);
    expect(r.targetPh).toBeCloseTo(2.9, 9); // pKa − 2
    expect(r.extractVolumeMl).toBe(50);
    // saturated NaHCO3 ≈ 1.1 M (CRC solubility ~8.7 % w/w): 2 × 25 mL carry ≈ 55 mmol; the acid used up ≈ 1.3 mmol of it
    expect(r.co2Mmol).toBeGreaterThan(45);
    expect(r.co2Mmol).toBeLessThan(56);
    expect(r.co2Ml).toBeCloseTo(r.co2Mmol * (((8.314462618 * 293.15) / 101325) * 1000), 3);
    expect(r.warnings.find((w: { code: string }) => w.code === "co2-gas").message).toMatch(/vent/i);
  });

  it("adds rotary-evaporator settings for the plan's solvent (ethyl acetate bp 77.1 °C at 1013 mbar, CRC)", async () => {
    const res = await compute({ ...issueExample, evaporation: { pressureMbar: 1013.25 } });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.evaporation.boilingPointC - 77.1)).toBeLessThan(0.5);
    expect(res.body.evaporation.bathC).toBeCloseTo(res.body.evaporation.boilingPointC + 20, 9);
  });

  it.each([
    ["no washes", { ...issueExample, washes: [] }, "washes"],
    ["a kind that does not exist", { ...issueExample, components: [{ ...issueExample.components[0], kind: "salt" }] }, "components[0].kind"],
    ["a negative volume", { ...issueExample, organic: { solvent: "EtOAc", volumeMl: -5 } }, "organic.volumeMl"],
    ["zero repeats", { ...issueExample, washes: [{ ...issueExample.washes[0], repeats: 0 }] }, "washes[0].repeats"],
    ["a temperature of 90 °C", { ...issueExample, temperatureC: 90 }, "temperatureC"],
    ["an acid without a pKa", { ...issueExample, components: [{ name: "acid", kind: "acid", partitionCoefficient: 3, amountMmol: 1 }] }, "components[0].pKa"],
    ["a component without an amount", { ...issueExample, components: [{ name: "x", kind: "neutral", partitionCoefficient: 3 }] }, "components[0].amountMmol"],
    ["a wash with no acid–base data", { ...issueExample, washes: [{ aqueous: { solute: "sucrose", concentration: M(1) }, volumeMl: 20 }] }, "washes[0].aqueous.solute"],
    ["recovering a neutral", { ...threeWashes, recovery: { component: "ketone product", reagent: { solute: "HCl", concentration: M(6) } } }, "recovery.component"],
    ["basifying with an acid", { ...issueExample, recovery: { component: "amine A", reagent: { solute: "HCl", concentration: M(6) } } }, "recovery.reagent.solute"],
    ["an evaporation pressure outside the constants", { ...issueExample, evaporation: { pressureMbar: 5 } }, "evaporation.pressureMbar"],
  ])("answers 400 naming the field for %s", async (_label, body, field) => {
    const res = await compute(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it("names the unknown solvent's field and suggests close names", async () => {
    const res = await compute({ ...issueExample, organic: { solvent: "ethyl acetat", volumeMl: 50 } });
    // one typo is forgiven by the look-up
    expect(res.status).toBe(200);
    const bad = await compute({ ...issueExample, organic: { solvent: "xylitol", volumeMl: 50 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields["organic.solvent"]).toMatch(/Unknown solvent/);
    expect(Array.isArray(bad.body.error.suggestions)).toBe(true);
  });
});

describe("saved plans", () => {
  let g: Awaited<ReturnType<typeof groupWithRoles>>;
  let other: Awaited<ReturnType<typeof groupWithRoles>>;
  let secondChemist: Awaited<ReturnType<typeof signUp>>;
  beforeAll(async () => {
    g = await groupWithRoles(t, "plans");
    other = await groupWithRoles(t, "elsewhere");
    secondChemist = await signUp(t.app, "plans-chemist-2");
    await t.db.execute(
      sql`insert into member (id, organization_id, user_id, role, created_at) values (${crypto.randomUUID()}, ${g.groupId}, ${secondChemist.userId}, 'chemist', now())`,
    );
  });

  it("refuses the list and a save without a session (401)", async () => {
    expect((await request(t.app).get("/api/plans")).status).toBe(401);
    expect((await request(t.app).post("/api/plans").send({ title: "x", input: issueExample })).status).toBe(401);
    expect((await request(t.app).get("/api/plans/anything")).status).toBe(401);
  });

  it("lets a chemist save, every member read, the author or a lead edit, others 403, another group 404", async () => {
    const created = await g.chemist.agent.post("/api/plans").send({ title: "Amine strip before the ketone column", notes: "Use the 125 mL funnel.", input: threeWashes });
    expect(created.status).toBe(201);
    const plan = created.body;
    expect(plan.title).toBe("Amine strip before the ketone column");
    expect(plan.input.organic.solvent).toBe("EtOAc");
    expect(plan.input.washes[1].aqueous.concentration).toBe("saturated");
    expect(plan.input.washes[0].aqueous.concentration).toEqual({ value: 1, unit: "mol/L" });
    expect(plan.author.name).toBe("plans-chemist");
    expect(plan.canEdit).toBe(true);
    expect(plan.updatedBy).toBeNull();

    // every member reads; only the author, a lead or the owner may edit
    const asOther = await secondChemist.agent.get(`/api/plans/${plan.id}`);
    expect(asOther.status).toBe(200);
    expect(asOther.body.canEdit).toBe(false);
    expect((await secondChemist.agent.patch(`/api/plans/${plan.id}`).send({ title: "mine now" })).status).toBe(403);
    expect((await secondChemist.agent.delete(`/api/plans/${plan.id}`)).status).toBe(403);

    const list = await g.lead.agent.get("/api/plans");
    expect(list.status).toBe(200);
    expect(list.body.plans).toHaveLength(1);
    expect(list.body.plans[0]).toMatchObject({ id: plan.id, solvent: "EtOAc", washCount: 3, componentNames: ["tolyl amine", "heptanoic acid", "ketone product"], canEdit: true });

    const edited = await g.lead.agent.patch(`/api/plans/${plan.id}`).send({ notes: "Checked: 125 mL funnel, vent the bicarbonate pass." });
    expect(edited.status).toBe(200);
    expect(edited.body.notes).toMatch(/vent the bicarbonate/);
    expect(edited.body.title).toBe("Amine strip before the ketone column");
    expect(edited.body.updatedBy.name).toBe("plans-lead");
    expect(new Date(edited.body.updatedAt).getTime()).toBeGreaterThanOrEqual(new Date(plan.updatedAt).getTime());

    const byAuthor = await g.chemist.agent.patch(`/api/plans/${plan.id}`).send({ input: { ...threeWashes, washes: threeWashes.washes.slice(0, 2) } });
    expect(byAuthor.status).toBe(200);
    expect(byAuthor.body.input.washes).toHaveLength(2);

    // another group's members cannot see it
    expect((await other.owner.agent.get(`/api/plans/${plan.id}`)).status).toBe(404);
    expect((await other.owner.agent.patch(`/api/plans/${plan.id}`).send({ title: "x" })).status).toBe(404);
    expect((await other.owner.agent.delete(`/api/plans/${plan.id}`)).status).toBe(404);
    expect((await other.owner.agent.get("/api/plans")).body.plans).toHaveLength(0);

    // the owner deletes
    expect((await g.owner.agent.delete(`/api/plans/${plan.id}`)).status).toBe(204);
    expect((await g.chemist.agent.get(`/api/plans/${plan.id}`)).status).toBe(404);
  });

  it("lets the author delete their own plan and lists newest changes first", async () => {
    const a = await g.chemist.agent.post("/api/plans").send({ title: "First", input: issueExample });
    const b = await g.chemist.agent.post("/api/plans").send({ title: "Second", input: issueExample });
    await g.chemist.agent.patch(`/api/plans/${a.body.id}`).send({ title: "First, revised" });
    const list = await g.chemist.agent.get("/api/plans");
    expect(list.body.plans.map((p: { title: string }) => p.title)).toEqual(["First, revised", "Second"]);
    expect((await g.chemist.agent.delete(`/api/plans/${a.body.id}`)).status).toBe(204);
    expect((await g.chemist.agent.delete(`/api/plans/${b.body.id}`)).status).toBe(204);
  });

  it.each([
    ["an empty title", { title: " ", input: issueExample }, "title"],
    ["no input", { title: "x" }, "input"],
    ["a wash without a volume", { title: "x", input: { ...issueExample, washes: [{ aqueous: { solute: "HCl" } }] } }, "input.washes[0].volumeMl"],
    ["an unknown solvent", { title: "x", input: { ...issueExample, organic: { solvent: "xylitol", volumeMl: 50 } } }, "input.organic.solvent"],
    ["a base without a pKa", { title: "x", input: { ...issueExample, components: [{ name: "b", kind: "base", partitionCoefficient: 5, amountMmol: 1 }] } }, "input.components[0].pKa"],
  ])("refuses %s with 400 naming the field", async (_label, body, field) => {
    const res = await g.chemist.agent.post("/api/plans").send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it("refuses an empty change and a change to a missing plan", async () => {
    const created = await g.chemist.agent.post("/api/plans").send({ title: "Kept", input: issueExample });
    const empty = await g.chemist.agent.patch(`/api/plans/${created.body.id}`).send({});
    expect(empty.status).toBe(400);
    expect((await g.chemist.agent.patch("/api/plans/no-such-plan").send({ title: "y" })).status).toBe(404);
  });
});
