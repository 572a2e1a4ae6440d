import request from "supertest";
import type { CreateCaseBody } from "../../knowledge/contracts/cases";
import type { RemedyAnswer, TroubleshootResponse } from "../../knowledge/contracts/emulsion";
import { agentFor, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { createCase } from "./case-helpers";

/*
 * Our fictional group's saponification work-ups: a halogenated solvent over 1 M NaOH. pH of
 * 1 mol/L NaOH = 14 + log10(1) = 14 (strong base, fully dissociated) → pH band ">12".
 */
const funnel = (solvent: string, aqueous: CreateCaseBody["system"]["aqueous"], attempts: CreateCaseBody["attempts"], title = "Soapy band after saponification"): CreateCaseBody => ({
  title,
  system: { organic: [{ solvent, volumeMl: 60 }], aqueous, temperatureC: 20 },
  causes: ["chlorinated-base"],
  attempts,
});
const naoh = { solute: "NaOH", concentration: { value: 1, unit: "mol/L" as const }, volumeMl: 60 };

const help = {
  system: {
    organic: [{ solvent: "DCM", volumeMl: 50 }],
    aqueous: { solute: "NaOH", concentration: { value: 1, unit: "M" }, volumeMl: 50 },
  },
  seen: { solids: true, emulsionFractionPct: 25 },
  known: { reagents: ["fatty-acid"], funnelMl: 250 },
};

const remedy = (r: TroubleshootResponse, id: string): RemedyAnswer => {
  const found = r.remedies.find((m) => m.id === id);
  if (!found) throw new Error(`remedy ${id} not ranked`);
  return found;
};

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;
let sourceId: string;
let noteId: string;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "advice");
  b = await groupWithRoles(t, "advice-other");
  const source = await createCase(
    a.chemist.agent,
    funnel("DCM", naoh, [
      { remedyId: "let-stand", outcome: "no-change", minutes: 20 },
      { remedyId: "filter-pad", outcome: "cleared", minutes: 15 },
    ]),
  );
  sourceId = source.id;
  // The hand count for the note (halogenated, pH > 12, filter pad):
  await createCase(a.chemist.agent, funnel("DCM", naoh, [{ remedyId: "filter-pad", outcome: "no-change" }, { remedyId: "centrifuge", outcome: "cleared" }])); // counts: tried
  await createCase(a.lead.agent, funnel("chloroform", naoh, [{ remedyId: "filter-pad", outcome: "cleared" }])); // counts: halogenated too
  await createCase(a.lead.agent, funnel("ethyl acetate", naoh, [{ remedyId: "filter-pad", outcome: "cleared" }])); // ester: not counted
  await createCase(a.lead.agent, funnel("DCM", { solute: "water", volumeMl: 60, ph: 7 }, [{ remedyId: "filter-pad", outcome: "cleared" }])); // pH 6–9: not counted
  const retired = await createCase(a.lead.agent, funnel("DCM", naoh, [{ remedyId: "filter-pad", outcome: "cleared" }], "Retired duplicate"));
  await a.lead.agent.post(`/api/cases/${retired.id}/retire`).send({ code: "duplicate", reason: "Logged twice." }).expect(200); // retired: not counted
  // Group B's own successes with the pad never count for A.
  await createCase(b.chemist.agent, funnel("DCM", naoh, [{ remedyId: "filter-pad", outcome: "cleared" }]));
});
afterAll(async () => {
  await t.close();
});

describe("POST /api/advice", () => {
  it("refuses a fix from a case that is not verified yet", async () => {
    const res = await a.lead.agent.post("/api/advice").send({ caseId: sourceId, text: "Filter through a pad before anything else." });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.caseId).toMatch(/not verified/);
  });

  it("promotes the verified fix into a note with the case's scope, its source and cleared n of m", async () => {
    await a.lead.agent.post(`/api/cases/${sourceId}/verify`).send({}).expect(200);
    const res = await a.lead.agent.post("/api/advice").send({ caseId: sourceId, text: "In this group, filter through a pad of diatomaceous earth first." });
    expect(res.status).toBe(201);
    noteId = res.body.id;
    expect(res.body).toMatchObject({
      remedyId: "filter-pad",
      solventFamily: "halogenated",
      phBand: ">12",
      causeCode: null,
      scope: "halogenated solvents over strongly basic water (pH above 12)",
      sources: [{ id: sourceId, verified: true, retired: false, whatWorked: "cleared by filtering through diatomaceous earth after 15 min" }],
      // Hand count above: the source (cleared), the DCM case (no change), the chloroform case (cleared).
      evidence: { cleared: 2, tried: 3 },
      createdBy: { id: a.lead.userId },
      version: 1,
      retired: false,
    });
    const log = (await a.lead.agent.get(`/api/audit?entityId=${noteId}`)).body.entries;
    expect(log.map((e: { action: string }) => e.action)).toEqual(["advice.create"]);
  });

  it("validates the promotion", async () => {
    const freeText = await createCase(a.chemist.agent, funnel("DCM", naoh, [{ remedyId: null, description: "stirred with a glass rod", outcome: "cleared" }]));
    await a.lead.agent.post(`/api/cases/${freeText.id}/verify`).send({}).expect(200);
    const noRemedy = await a.lead.agent.post("/api/advice").send({ caseId: freeText.id, text: "Stir the band with a glass rod." });
    expect(noRemedy.status).toBe(400);
    expect(noRemedy.body.error.fields.attemptId).toMatch(/no remedy/);

    const short = await a.lead.agent.post("/api/advice").send({ caseId: sourceId, text: "pad" });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.text).toBeDefined();
    expect((await a.lead.agent.post("/api/advice").send({ caseId: sourceId, text: "Filter first, always.", phBand: "8-10" })).status).toBe(400);

    const foreign = await createCase(b.chemist.agent, funnel("DCM", naoh, [{ remedyId: "filter-pad", outcome: "cleared" }]));
    expect((await a.lead.agent.post("/api/advice").send({ caseId: foreign.id, text: "Filter first, always." })).status).toBe(404);
    expect((await a.lead.agent.post("/api/advice").send({ caseId: sourceId, text: "Filter first, always.", alsoCaseIds: [foreign.id] })).status).toBe(404);
    expect((await a.chemist.agent.post("/api/advice").send({ caseId: sourceId, text: "Filter first, always." })).status).toBe(403);
    expect((await agentFor(t.app).post("/api/advice").send({ caseId: sourceId, text: "Filter first, always." })).status).toBe(401);
  });
});

describe("the note in the emulsion help", () => {
  it("shows on the remedy for the group's own chemists, with its evidence and source", async () => {
    const r = (await a.chemist.agent.post("/api/troubleshoot").send(help)).body as TroubleshootResponse;
    const pad = remedy(r, "filter-pad");
    expect(pad.groupNotes).toHaveLength(1);
    const text = pad.groupNotes![0]!.text;
    expect(text).toMatch(/^In this group, filter through a pad of diatomaceous earth first\. — /);
    expect(text).toContain("group advice for halogenated solvents over strongly basic water (pH above 12)");
    expect(text).toContain("“Soapy band after saponification”");
    // cleared n of m travels beside the text (the hand count in beforeAll)
    expect(pad.groupNotes![0]).toMatchObject({ solventFamily: "halogenated", phBand: ">12", evidence: { cleared: 2, tried: 3 } });
    // The note sits on its remedy only.
    for (const m of r.remedies.filter((x) => x.id !== "filter-pad")) expect(m.groupNotes).toBeUndefined();
  });

  it("is not shown to another group, nor without a session", async () => {
    const other = (await b.chemist.agent.post("/api/troubleshoot").send(help)).body as TroubleshootResponse;
    expect(remedy(other, "filter-pad").groupNotes).toBeUndefined();
    const anonymous = (await request(t.app).post("/api/troubleshoot").send(help)).body as TroubleshootResponse;
    expect(remedy(anonymous, "filter-pad").groupNotes).toBeUndefined();
    const list = await b.lead.agent.get("/api/advice");
    expect(list.body.notes).toEqual([]);
  });

  it("is not shown for a system outside its scope (near-neutral water)", async () => {
    const neutral = { ...help, system: { ...help.system, aqueous: { solute: "water", volumeMl: 50 } }, known: { ...help.known, ph: 7 } };
    const r = (await a.chemist.agent.post("/api/troubleshoot").send(neutral)).body as TroubleshootResponse;
    expect(remedy(r, "filter-pad").groupNotes).toBeUndefined();
  });
});

describe("PATCH /api/advice/:id", () => {
  it("retires with a reason and restores; the emulsion help follows", async () => {
    expect((await a.lead.agent.patch(`/api/advice/${noteId}`).send({ retired: true })).status).toBe(400);
    const retired = await a.lead.agent.patch(`/api/advice/${noteId}`).send({ retired: true, reason: "The pad lot changed; re-check first." });
    expect(retired.status).toBe(200);
    expect(retired.body).toMatchObject({ retired: true, retiredReason: "The pad lot changed; re-check first.", version: 2 });
    let r = (await a.chemist.agent.post("/api/troubleshoot").send(help)).body as TroubleshootResponse;
    expect(remedy(r, "filter-pad").groupNotes).toBeUndefined();
    expect((await a.chemist.agent.get("/api/advice")).body.notes).toEqual([]);
    expect((await a.chemist.agent.get("/api/advice?includeRetired=true")).body.notes).toHaveLength(1);

    const back = await a.lead.agent.patch(`/api/advice/${noteId}`).send({ retired: false });
    expect(back.body).toMatchObject({ retired: false, version: 3 });
    r = (await a.chemist.agent.post("/api/troubleshoot").send(help)).body as TroubleshootResponse;
    expect(remedy(r, "filter-pad").groupNotes).toHaveLength(1);

    const edited = await a.lead.agent.patch(`/api/advice/${noteId}`).send({ text: "Filter the whole mixture through a pad first." });
    expect(edited.body).toMatchObject({ text: "Filter the whole mixture through a pad first.", version: 4 });

    const log = (await a.lead.agent.get(`/api/audit?entityId=${noteId}&sort=oldest`)).body.entries;
    expect(log.map((e: { action: string }) => e.action)).toEqual(["advice.create", "advice.retire", "advice.restore", "advice.update"]);
    // Bring the first wording back from the log.
    const restored = await a.lead.agent.post(`/api/audit/${log[3].id}/restore`).send({ version: "before" });
    expect(restored.status).toBe(200);
    const now = (await a.chemist.agent.get("/api/advice")).body.notes[0];
    expect(now).toMatchObject({ text: "In this group, filter through a pad of diatomaceous earth first.", version: 5 });
  });

  it("is for the group's leads: 403 for a chemist, 404 for another group, 400 for an empty change", async () => {
    expect((await a.chemist.agent.patch(`/api/advice/${noteId}`).send({ text: "Something else entirely." })).status).toBe(403);
    expect((await b.lead.agent.patch(`/api/advice/${noteId}`).send({ text: "Something else entirely." })).status).toBe(404);
    expect((await a.lead.agent.patch(`/api/advice/${noteId}`).send({})).status).toBe(400);
    expect((await agentFor(t.app).get("/api/advice")).status).toBe(401);
  });
});
