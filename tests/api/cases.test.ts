import { agentFor, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { couplingCase, createCase } from "./case-helpers";

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "larch");
  b = await groupWithRoles(t, "elsewhere");
});
afterAll(async () => {
  await t.close();
});

describe("POST /api/cases", () => {
  it("logs a case with its attempts and derives the layers, signature and what worked", async () => {
    const res = await a.chemist.agent.post("/api/cases").send(
      couplingCase({
        attempts: [
          { remedyId: "let-stand", minutes: 20, outcome: "no-change" },
          { remedyId: "filter-pad", amount: "2 cm pad in a 60 mL sinter", minutes: 15, outcome: "cleared", note: "Filtered the whole mixture." },
        ],
      }),
    );
    expect(res.status).toBe(201);
    const c = res.body;
    expect(c.authorId).toBe(a.chemist.userId);
    expect(c.system.organic[0]).toMatchObject({ solvent: "DCM", key: "dichloromethane", family: "halogenated" });
    expect(c.system.aqueous).toMatchObject({ key: "sodium-bicarbonate" });
    // Dichloromethane 1.3266 g/mL at 20 °C (CRC Handbook) against saturated NaHCO3 ≈ 1.06 g/mL (CRC
    // concentrative properties, 8.7 % w/w): the organic layer is the bottom one by a wide margin.
    expect(c.predicted.bottom).toBe("organic");
    expect(c.predicted.organicDensityGPerMl).toBeCloseTo(1.3266, 3);
    expect(c.predicted.aqueousDensityGPerMl).toBeGreaterThan(1.05);
    expect(c.predicted.aqueousDensityGPerMl).toBeLessThan(1.07);
    expect(c.layerSurprise).toBe(false);
    // Bicarbonate is amphoteric: pH ≈ (pKa1 + pKa2) / 2 = (6.35 + 10.33) / 2 = 8.34 (CRC pKa of carbonic acid) → band 6–9.
    expect(c.phBand).toBe("6-9");
    expect(c.solventFamily).toBe("halogenated");
    expect(c.attempts.map((x: { position: number }) => x.position)).toEqual([1, 2]);
    expect(c.attempts[1]).toMatchObject({ remedyId: "filter-pad", outcome: "cleared", authorId: a.chemist.userId });
    expect(c.whatWorked).toBe("cleared by filtering through diatomaceous earth after 15 min");
    expect(c.bestOutcome).toBe("cleared");
    expect(c.canEdit).toBe(true);
    expect(c.following).toBe(true);
    expect(c.verified).toBe(false);
    expect(c.verifiedBy).toBeNull();
    expect(c.mergedInto).toBeNull();
  });

  it("flags an observed order that contradicts the prediction", async () => {
    const c = await createCase(a.chemist.agent, couplingCase({ observedBottom: "aqueous" }));
    expect(c.layerSurprise).toBe(true);
  });

  it("keeps a name the tables do not know, without a prediction", async () => {
    const c = await createCase(
      a.chemist.agent,
      couplingCase({
        title: "Aluminium salts after hydride quench",
        system: {
          organic: [{ solvent: "MTBE", volumeMl: 150 }],
          aqueous: { solute: "Rochelle salt", concentration: { value: 20, unit: "%w/w" }, volumeMl: 100 },
          temperatureC: 20,
        },
      }),
    );
    expect(c.predicted).toBeNull();
    expect((c.system as { aqueous: { key: string | null; name: string } }).aqueous).toMatchObject({ key: null, name: "Rochelle salt" });
    expect(c.solventFamily).toBe("ether");
    expect(c.phBand).toBeNull();
  });

  it.each([
    ["a missing title", { title: "" }, "title"],
    ["no organic solvent", { system: { organic: [], aqueous: { solute: "water", volumeMl: 10 } } }, "system.organic"],
    ["a negative volume", { system: { organic: [{ solvent: "DCM", volumeMl: -5 }], aqueous: { solute: "water", volumeMl: 10 } } }, "system.organic.0.volumeMl"],
    ["an unknown outcome", { attempts: [{ remedyId: "let-stand", outcome: "fixed" }] }, "attempts.0.outcome"],
    ["an attempt with neither remedy nor description", { attempts: [{ outcome: "cleared" }] }, "attempts.0.remedyId"],
    ["an unknown emulsion kind", { seen: { kind: "custard" } }, "seen.kind"],
    ["a bad status", { status: "closed" }, "status"],
    ["a remedy id that is not a slug", { attempts: [{ remedyId: "Brine!!", outcome: "cleared" }] }, "attempts.0.remedyId"],
  ])("answers 400 for %s", async (_label, patch, field) => {
    const res = await a.chemist.agent.post("/api/cases").send({ ...couplingCase(), ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it("answers 400 for a concentration beyond saturation (NaCl saturates at 26.4 % w/w at 20 °C, CRC)", async () => {
    const res = await a.chemist.agent.post("/api/cases").send(
      couplingCase({ system: { organic: [{ solvent: "DCM", volumeMl: 50 }], aqueous: { solute: "NaCl", concentration: { value: 40, unit: "%w/w" }, volumeMl: 50 } } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(["system.aqueous.concentration"]);
  });

  it("answers 401 without a session and 403 without a group", async () => {
    expect((await agentFor(t.app).post("/api/cases").send(couplingCase())).status).toBe(401);
    const loner = await (await import("./harness")).signUp(t.app, "loner");
    expect((await loner.agent.post("/api/cases").send(couplingCase())).status).toBe(403);
  });
});

describe("GET /api/cases and /api/cases/:id", () => {
  let caseId: string;
  let otherGroupCase: string;
  beforeAll(async () => {
    caseId = (await createCase(a.lead.agent, couplingCase({ title: "Lead's phase-transfer alkylation" }))).id;
    otherGroupCase = (await createCase(b.owner.agent, couplingCase({ title: "Elsewhere's rag layer" }))).id;
  });

  it("lists the group's cases only", async () => {
    const res = await a.chemist.agent.get("/api/cases");
    expect(res.status).toBe(200);
    const ids = res.body.cases.map((c: { id: string }) => c.id);
    expect(ids).toContain(caseId);
    expect(ids).not.toContain(otherGroupCase);
    expect(res.body.total).toBe(ids.length);
    const mine = res.body.cases.find((c: { id: string }) => c.id === caseId);
    expect(mine).toMatchObject({ authorName: "larch-lead", solvents: ["Dichloromethane"], aqueousLabel: "saturated sodium bicarbonate" });
  });

  it("shows a case to every member of its group, and to nobody else", async () => {
    const res = await a.chemist.agent.get(`/api/cases/${caseId}`);
    expect(res.status).toBe(200);
    expect(res.body.title).toBe("Lead's phase-transfer alkylation");
    expect(res.body.canEdit).toBe(false);
    expect((await b.owner.agent.get(`/api/cases/${caseId}`)).status).toBe(404);
    expect((await a.chemist.agent.get(`/api/cases/${otherGroupCase}`)).status).toBe(404);
    expect((await a.chemist.agent.get("/api/cases/no-such-case")).status).toBe(404);
    expect((await agentFor(t.app).get(`/api/cases/${caseId}`)).status).toBe(401);
    expect((await agentFor(t.app).get("/api/cases")).status).toBe(401);
  });

  it("answers 400 for a bad filter", async () => {
    const res = await a.chemist.agent.get("/api/cases?status=closed&limit=0");
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(["status", "limit"]));
  });
});

describe("PATCH /api/cases/:id", () => {
  let chemistCase: string;
  let leadCase: string;
  beforeAll(async () => {
    chemistCase = (await createCase(a.chemist.agent)).id;
    leadCase = (await createCase(a.lead.agent)).id;
  });

  it("lets the author edit, and re-derives the system when it changes", async () => {
    const res = await a.chemist.agent.patch(`/api/cases/${chemistCase}`).send({
      status: "resolved",
      seen: { colour: "pale yellow" },
      system: {
        organic: [{ solvent: "ethyl acetate", volumeMl: 120 }],
        aqueous: { solute: "NaOH", concentration: { value: 1, unit: "mol/L" }, volumeMl: 60 },
        temperatureC: 20,
      },
    });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("resolved");
    // Only the colour changed; the rest of what was seen is kept.
    expect(res.body.seen).toMatchObject({ colour: "pale yellow", kind: "rag-with-solids", solids: true });
    // 1 mol/L NaOH: pH = 14 + log10(1) = 14 (strong base, Kw = 1e-14 at 25 °C) → band ">12".
    expect(res.body.phBand).toBe(">12");
    expect(res.body.solventFamily).toBe("ester");
    // Ethyl acetate 0.900 g/mL (CRC) floats on 1 M NaOH (≈1.04 g/mL, CRC).
    expect(res.body.predicted.bottom).toBe("aqueous");
  });

  it("lets a lead or an owner edit someone else's case", async () => {
    expect((await a.lead.agent.patch(`/api/cases/${chemistCase}`).send({ notes: "Checked by the lead." })).status).toBe(200);
    expect((await a.owner.agent.patch(`/api/cases/${chemistCase}`).send({ tags: ["scale up"] })).body.tags).toEqual(["scale-up"]);
  });

  it("refuses a chemist editing another's case (403), another group (404), no session (401), an empty patch (400)", async () => {
    const denied = await a.chemist.agent.patch(`/api/cases/${leadCase}`).send({ title: "Mine now" });
    expect(denied.status).toBe(403);
    expect((await a.chemist.agent.get(`/api/cases/${leadCase}`)).body.title).toBe("Rag layer after amide coupling wash");
    expect((await b.owner.agent.patch(`/api/cases/${leadCase}`).send({ title: "Ours now" })).status).toBe(404);
    expect((await agentFor(t.app).patch(`/api/cases/${leadCase}`).send({ title: "x" })).status).toBe(401);
    expect((await a.lead.agent.patch(`/api/cases/${leadCase}`).send({})).status).toBe(400);
    expect((await a.lead.agent.patch(`/api/cases/${leadCase}`).send({ status: "done" })).status).toBe(400);
  });
});

describe("attempts", () => {
  let caseId: string;
  beforeAll(async () => {
    caseId = (await createCase(a.chemist.agent)).id;
  });

  it("adds attempts in order and edits one", async () => {
    const first = await a.chemist.agent.post(`/api/cases/${caseId}/attempts`).send({ remedyId: "saturated-brine", amount: "20 mL", minutes: 10, outcome: "partly" });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ position: 1, label: "Saturated brine", outcome: "partly" });
    const second = await a.chemist.agent.post(`/api/cases/${caseId}/attempts`).send({ description: "Added 5 mL methanol and swirled", outcome: "cleared", minutes: 5 });
    expect(second.status).toBe(201);
    expect(second.body.position).toBe(2);
    let c = (await a.chemist.agent.get(`/api/cases/${caseId}`)).body;
    expect(c.whatWorked).toBe("cleared with “Added 5 mL methanol and swirled” after 5 min");

    const edited = await a.chemist.agent.patch(`/api/cases/${caseId}/attempts/${first.body.id}`).send({ outcome: "cleared" });
    expect(edited.status).toBe(200);
    expect(edited.body.outcome).toBe("cleared");
    c = (await a.chemist.agent.get(`/api/cases/${caseId}`)).body;
    // The first attempt that cleared is the one shown.
    expect(c.whatWorked).toBe("cleared with saturated brine after 10 min");
    expect(c.attemptCount).toBe(2);
  });

  it("lets a lead add an attempt to a chemist's case", async () => {
    const res = await a.lead.agent.post(`/api/cases/${caseId}/attempts`).send({ remedyId: "centrifuge", outcome: "no-change" });
    expect(res.status).toBe(201);
    expect(res.body.authorId).toBe(a.lead.userId);
  });

  it("refuses bad attempts and other people's cases", async () => {
    const leadCase = (await createCase(a.lead.agent)).id;
    expect((await a.chemist.agent.post(`/api/cases/${caseId}/attempts`).send({ outcome: "cleared" })).status).toBe(400);
    expect((await a.chemist.agent.post(`/api/cases/${caseId}/attempts`).send({ remedyId: "let-stand", outcome: "solved" })).status).toBe(400);
    expect((await a.chemist.agent.post(`/api/cases/${caseId}/attempts`).send({ remedyId: "let-stand", outcome: "cleared", minutes: -1 })).status).toBe(400);
    expect((await a.chemist.agent.post(`/api/cases/${leadCase}/attempts`).send({ remedyId: "let-stand", outcome: "cleared" })).status).toBe(403);
    expect((await b.owner.agent.post(`/api/cases/${caseId}/attempts`).send({ remedyId: "let-stand", outcome: "cleared" })).status).toBe(404);
    expect((await agentFor(t.app).post(`/api/cases/${caseId}/attempts`).send({ remedyId: "let-stand", outcome: "cleared" })).status).toBe(401);
  });

  it("refuses attempt edits that are empty, blank out the remedy, or name an attempt of another case", async () => {
    const c = (await a.chemist.agent.get(`/api/cases/${caseId}`)).body;
    const brine = c.attempts[0].id as string;
    expect((await a.chemist.agent.patch(`/api/cases/${caseId}/attempts/${brine}`).send({})).status).toBe(400);
    expect((await a.chemist.agent.patch(`/api/cases/${caseId}/attempts/${brine}`).send({ remedyId: null })).status).toBe(400);
    const other = await createCase(a.chemist.agent, couplingCase({ attempts: [{ remedyId: "let-stand", outcome: "no-change" }] }));
    const otherAttempt = (other as unknown as { attempts: { id: string }[] }).attempts[0]!.id;
    expect((await a.chemist.agent.patch(`/api/cases/${caseId}/attempts/${otherAttempt}`).send({ outcome: "worse" })).status).toBe(404);
    expect((await b.owner.agent.patch(`/api/cases/${caseId}/attempts/${brine}`).send({ outcome: "worse" })).status).toBe(404);
    const leadCase = await createCase(a.lead.agent, couplingCase({ attempts: [{ remedyId: "let-stand", outcome: "no-change" }] }));
    const leadAttempt = (leadCase as unknown as { attempts: { id: string }[] }).attempts[0]!.id;
    expect((await a.chemist.agent.patch(`/api/cases/${leadCase.id}/attempts/${leadAttempt}`).send({ outcome: "cleared" })).status).toBe(403);
  });
});

describe("following", () => {
  it("follows and unfollows a case of the group", async () => {
    const caseId = (await createCase(a.lead.agent)).id;
    const on = await a.chemist.agent.post(`/api/cases/${caseId}/follow`).send({});
    expect(on.status).toBe(200);
    // The author follows their own case from the start.
    expect(on.body).toEqual({ following: true, followerCount: 2 });
    expect((await a.chemist.agent.post(`/api/cases/${caseId}/follow`).send({})).body.followerCount).toBe(2);
    expect((await a.chemist.agent.get("/api/cases")).body.cases.find((c: { id: string }) => c.id === caseId).following).toBe(true);
    const off = await a.chemist.agent.delete(`/api/cases/${caseId}/follow`);
    expect(off.body).toEqual({ following: false, followerCount: 1 });
    expect((await b.owner.agent.post(`/api/cases/${caseId}/follow`).send({})).status).toBe(404);
    expect((await agentFor(t.app).post(`/api/cases/${caseId}/follow`).send({})).status).toBe(401);
  });
});
