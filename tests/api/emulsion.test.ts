import express from "express";
import request from "supertest";
import { PRIOR_STRENGTH, REMEDIES, type EvidenceRecord } from "../../knowledge/emulsion";
import type { RemedyAnswer, TroubleshootResponse } from "../../knowledge/contracts/emulsion";
import { errorHandler } from "../../server/middleware/errors";
import { loadSession } from "../../server/middleware/session";
import { emulsionRouter, type GroupKnowledge } from "../../server/routes/emulsion";
import type { CreateCaseBody } from "../../knowledge/contracts/cases";
import { createCase } from "./case-helpers";
import { ORIGIN, groupWithRoles, signUp, startTestApp, type TestApp } from "./harness";

/*
 * A work-up of our fictional group: 50 mL dichloromethane over 50 mL 1 M NaOH after an ester
 * hydrolysis that left a fatty acid, solids seen in the band, a 250 mL funnel.
 */
const body = {
  system: {
    organic: [{ solvent: "DCM", volumeMl: 50 }],
    aqueous: { solute: "NaOH", concentration: { value: 1, unit: "M" }, volumeMl: 50 },
  },
  seen: { solids: true, emulsionFractionPct: 25 },
  known: { reagents: ["fatty-acid"], funnelMl: 250 },
};

const byId = (r: TroubleshootResponse, id: string): RemedyAnswer => {
  const found = r.remedies.find((m) => m.id === id);
  if (!found) throw new Error(`remedy ${id} not ranked`);
  return found;
};

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe("POST /api/troubleshoot", () => {
  it("answers without a session: causes, ranked remedies with time, risks and the computed after-line", async () => {
    const res = await request(t.app).post("/api/troubleshoot").send(body);
    expect(res.status).toBe(200);
    const r = res.body as TroubleshootResponse;
    expect(r.groupEvidence).toBe(false);
    expect(r.causes.map((c) => c.code)).toEqual(expect.arrayContaining(["chlorinated-base", "surfactant-soap", "fine-solids"]));
    for (const c of r.causes) expect(c.reasons.length).toBeGreaterThan(0);
    // solids seen in a chlorinated/base band: the filter pad leads
    expect(r.remedies[0]?.id).toBe("filter-pad");
    for (const m of r.remedies) {
      expect(m.reasons.length).toBeGreaterThan(0);
      expect(m.minutes.min).toBeLessThanOrEqual(m.minutes.max);
      expect(m.evidence).toBeUndefined();
    }
    // scores are sorted best first
    const scores = r.remedies.map((m) => m.score);
    expect([...scores].sort((a, b) => b - a)).toEqual(scores);

    // 25 % of the 50 mL aqueous layer as saturated brine, to the mL: 13 mL (amounts.ts, common practice).
    // Masses add, volumes add: 1 M NaOH 1.041 g/mL (CRC concentrative properties, 3.9 % w/w), saturated
    // NaCl 1.197 g/mL (CRC, 26.4 % w/w), dichloromethane 1.327 g/mL (CRC), all at 20 °C:
    // aqueous (50·1.041 + 13·1.197) / 63 = 1.073 g/mL, gap 1.327 − 1.073 = 0.254, fill (50 + 63) / 250 = 0.452.
    const brine = byId(r, "saturated-brine");
    expect(brine.steps[0]).toContain("10–15 mL");
    expect(brine.after?.bottom).toBe("organic");
    expect(brine.after?.swapsLayers).toBe(false);
    expect(brine.after?.aqueousVolumeMl).toBeCloseTo(63, 0);
    expect(Math.abs(brine.after!.densityDifferenceGPerMl - 0.254)).toBeLessThan(0.005);
    expect(brine.after?.funnelFillFraction).toBeCloseTo(0.452, 2);
    expect(r.layers.densityDifferenceGPerMl).toBeCloseTo(1.327 - 1.041, 2);
    expect(r.layers.bottom).toBe("organic");
    // sources come with their titles
    expect(brine.sources[0]).toEqual({ key: expect.any(String), title: expect.stringMatching(/\w{10,}/) });
    expect(r.prevention.length).toBeGreaterThan(0);
    expect(r.escalation.length).toBeGreaterThan(0);
  });

  it("applies defaults: no seen, no known, room temperature", async () => {
    const res = await request(t.app)
      .post("/api/troubleshoot")
      .send({ system: { organic: [{ solvent: "ethyl acetate", volumeMl: 100 }], aqueous: { solute: "water", volumeMl: 100 } } });
    expect(res.status).toBe(200);
    expect(res.body.layers.top).toBe("organic");
    expect(res.body.remedies.length).toBeGreaterThan(0);
  });

  it.each([
    [
      "schema fields, prefixed as in the body",
      {
        system: { organic: [{ solvent: "DCM", volumeMl: -5 }], aqueous: { solute: "water", volumeMl: 10 } },
        seen: { emulsionFractionPct: 140 },
        known: { shaking: "hard" },
      },
      {
        "system.organic[0].volumeMl": "The volume must be more than 0 mL.",
        "seen.emulsionFractionPct": "The emulsified share must be 0–100 %.",
        "known.shaking": "Shaking is gentle, normal or vigorous.",
      },
    ],
    ["a missing system", { seen: {} }, { system: expect.any(String) }],
    [
      "an unknown solvent, found by the knowledge module",
      { system: { organic: [{ solvent: "xyzzy", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 } } },
      { "system.organic[0].solvent": expect.stringMatching(/Unknown solvent/) },
    ],
    [
      "a concentration beyond saturation",
      { system: { organic: [{ solvent: "toluene", volumeMl: 10 }], aqueous: { solute: "NaCl", concentration: { value: 40, unit: "%" }, volumeMl: 10 } } },
      { "system.aqueous.concentration": expect.any(String) },
    ],
  ])("400 with field messages: %s", async (_name, bad, fields) => {
    const res = await request(t.app).post("/api/troubleshoot").send(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual(expect.objectContaining(fields));
  });

  it("suggests the solvent meant", async () => {
    const res = await request(t.app)
      .post("/api/troubleshoot")
      .send({ system: { organic: [{ solvent: "chloromethyl", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 } } });
    expect(res.status).toBe(400);
    expect(res.body.error.suggestions).toContain("Dichloromethane");
  });
});

describe("group evidence from the case log", () => {
  /* Cases logged by each group on the same kind of funnel: DCM over 1 M NaOH (pH band ">12"). */
  const dcmOverNaoh = (title: string, causes: string[], attempts: CreateCaseBody["attempts"]): CreateCaseBody => ({
    title,
    system: {
      organic: [{ solvent: "dichloromethane", volumeMl: 60 }],
      aqueous: { solute: "NaOH", concentration: { value: 1, unit: "mol/L" }, volumeMl: 60 },
      temperatureC: 20,
    },
    causes,
    attempts,
  });

  it("blends only the caller's own group's cases into the ranking: cleared n of m, Beta prior of 4", async () => {
    const a = await groupWithRoles(t, "evidence-a");
    const b = await groupWithRoles(t, "evidence-b");
    // Group A: the centrifuge cleared two bands and failed once; a free-text attempt names no remedy.
    await createCase(
      a.chemist.agent,
      dcmOverNaoh("Soapy band after saponification", ["chlorinated-base"], [
        { remedyId: "let-stand", outcome: "no-change", minutes: 20 },
        { remedyId: "centrifuge", outcome: "cleared", minutes: 10 },
      ]),
    );
    await createCase(a.lead.agent, dcmOverNaoh("Second batch, same band", ["chlorinated-base"], [{ remedyId: "centrifuge", outcome: "cleared" }]));
    await createCase(
      a.owner.agent,
      dcmOverNaoh("Pilot run", [], [
        { remedyId: "centrifuge", outcome: "no-change" },
        { remedyId: null, description: "stirred with a spatula", outcome: "partly" },
      ]),
    );
    // Group B: the filter pad worked three times; A must never see it.
    await createCase(
      b.chemist.agent,
      dcmOverNaoh("B's band", ["chlorinated-base"], [
        { remedyId: "filter-pad", outcome: "cleared" },
        { remedyId: "filter-pad", outcome: "cleared" },
        { remedyId: "filter-pad", outcome: "cleared" },
      ]),
    );

    const anonymous = (await request(t.app).post("/api/troubleshoot").send(body)).body as TroubleshootResponse;
    expect(anonymous.causes[0]?.code).toBe("chlorinated-base");
    const spinPrior = byId(anonymous, "centrifuge").priorScore;
    const padPrior = byId(anonymous, "filter-pad").priorScore;

    const res = await a.chemist.agent.post("/api/troubleshoot").send(body);
    expect(res.status).toBe(200);
    const r = res.body as TroubleshootResponse;
    expect(r.groupEvidence).toBe(true);
    const spin = byId(r, "centrifuge");
    expect(spin.evidence).toEqual({ cleared: 2, tried: 3, smoothedRate: expect.any(Number) });
    // (successes + k·p₀) / (tries + k), k = 4: two cleared, one no change
    expect(PRIOR_STRENGTH).toBe(4);
    expect(spin.score).toBeCloseTo((2 + 4 * spinPrior) / (3 + 4), 3);
    expect(spin.reasons).toContain("group cases on similar systems: cleared 2 of 3");
    // waiting failed once: (0 + 4·p₀) / (1 + 4)
    expect(byId(r, "let-stand").evidence).toEqual({ cleared: 0, tried: 1, smoothedRate: expect.any(Number) });
    // group B's filter-pad successes are not A's
    expect(byId(r, "filter-pad").evidence).toBeUndefined();
    expect(byId(r, "filter-pad").score).toBe(padPrior);

    const other = (await b.owner.agent.post("/api/troubleshoot").send(body)).body as TroubleshootResponse;
    expect(byId(other, "filter-pad").evidence).toEqual({ cleared: 3, tried: 3, smoothedRate: expect.any(Number) });
    expect(byId(other, "filter-pad").score).toBeCloseTo((3 + 4 * padPrior) / (3 + 4), 3);
    expect(byId(other, "centrifuge").evidence).toBeUndefined();
  });

  it("a signed-in user without a group gets the public answer", async () => {
    const loner = await signUp(t.app, "no-group");
    const res = await loner.agent.post("/api/troubleshoot").send(body);
    expect(res.status).toBe(200);
    expect(res.body.groupEvidence).toBe(false);
  });

  it("never uses another group's records, even when a reader hands them over", async () => {
    const a = await groupWithRoles(t, "evidence-c");
    const record = (groupId: string, remedyId: string): EvidenceRecord => ({ groupId, remedyId, outcome: "cleared", solventFamily: "halogenated", phBand: ">12" });
    const asked: string[] = [];
    const reader: GroupKnowledge = {
      evidence: async (_db, groupId) => {
        asked.push(groupId);
        return [record(groupId, "centrifuge"), record("some-other-group", "filter-pad")];
      },
      notes: async () => [],
    };
    // The real session and group resolution around the route, with the reader above.
    const app = express();
    app.use(express.json());
    app.use("/api", loadSession(t.deps.auth));
    app.use("/api", emulsionRouter(t.deps, reader));
    app.use(errorHandler);
    const signIn = await request(t.app).post("/api/auth/sign-in/email").set("Origin", ORIGIN).send({ email: a.lead.email, password: a.lead.password });
    const cookie = signIn.headers["set-cookie"] as unknown as string[];

    const r = (await request(app).post("/api/troubleshoot").set("Cookie", cookie).send(body)).body as TroubleshootResponse;
    expect(asked).toEqual([a.groupId]);
    expect(byId(r, "centrifuge").evidence?.tried).toBe(1);
    expect(byId(r, "filter-pad").evidence).toBeUndefined();
  });
});

describe("GET /api/remedies", () => {
  it("lists the whole catalogue with mechanism, steps, time, risks and titled sources", async () => {
    const res = await request(t.app).get("/api/remedies");
    expect(res.status).toBe(200);
    expect(res.body.remedies).toHaveLength(REMEDIES.length);
    expect(res.body.remedies.length).toBeGreaterThanOrEqual(15);
    expect(res.body.scaleNote).toMatch(/100 mL/);
    for (const r of res.body.remedies) {
      expect(r.steps.length).toBeGreaterThan(0);
      expect(r.mechanism.length).toBeGreaterThan(20);
      expect(r.sources.length).toBeGreaterThan(0);
      for (const s of r.sources) expect(s.title).not.toBe(s.key);
    }
  });

  it("gives one remedy, its steps scaled to the catalogue's 100 mL example", async () => {
    const res = await request(t.app).get("/api/remedies/saturated-brine");
    expect(res.status).toBe(200);
    expect(res.body.id).toBe("saturated-brine");
    // 20–30 % of the 100 mL aqueous layer (common practice, amounts.ts)
    expect(res.body.steps[0]).toContain("20–30 mL");
  });

  it("404 for an unknown remedy", async () => {
    const res = await request(t.app).get("/api/remedies/holy-water");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("not_found");
  });
});
