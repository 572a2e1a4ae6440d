import sharp from "sharp";
import { sql } from "drizzle-orm";
import { BACKUP_MEDIA_TYPE, BACKUP_TABLES, type BackupDocument } from "../../knowledge/contracts/backup";
import { writeBackup } from "../../server/backup";
import { agentFor, groupWithRoles, startTestApp, type Agent, type TestApp } from "./harness";
import { couplingCase, createCase } from "./case-helpers";

/*
 * Export–import round trip: a group with every kind of record is exported, imported into an
 * empty group, and exported again; both exports must say the same thing once ids are read as
 * what they point at (a case by its title, an attempt by its case and place, a person by e-mail).
 */

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let source: BackupDocument;
let sourceText: string;
let sourceRecordsHeader: number;
let photoBytes: Buffer;

async function download(agent: Agent) {
  const res = await agent.get("/api/backup").buffer(true).parse((r, done) => {
    let text = "";
    r.setEncoding("utf8");
    r.on("data", (c: string) => (text += c));
    r.on("end", () => done(null, text));
  });
  expect(res.status).toBe(200);
  return { text: res.body as string, doc: JSON.parse(res.body as string) as BackupDocument, headers: res.headers };
}

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "backup");
  photoBytes = await sharp({ create: { width: 16, height: 12, channels: 3, background: { r: 90, g: 120, b: 60 } } }).png().toBuffer();

  const kept = await createCase(
    a.chemist.agent,
    couplingCase({
      title: "Kept: urea rag after coupling",
      status: "resolved",
      attempts: [
        { remedyId: "let-stand", minutes: 20, outcome: "no-change" },
        { remedyId: "filter-pad", minutes: 15, outcome: "cleared", note: "Filtered the whole mixture." },
      ],
    }),
  );
  const dup = await createCase(a.lead.agent, couplingCase({ title: "Duplicate of the urea rag", attempts: [{ remedyId: "saturated-brine", minutes: 10, outcome: "partly" }] }));
  const other = await createCase(
    a.chemist.agent,
    couplingCase({
      title: "Hazy ether layer",
      system: { organic: [{ solvent: "MTBE", volumeMl: 80 }], aqueous: { solute: "water", volumeMl: 40, ph: 7 }, temperatureC: 20 },
      attempts: [{ remedyId: "dry-organic", outcome: "cleared" }],
    }),
  );
  await a.chemist.agent.post(`/api/cases/${kept.id}/photos`).attach("photo", photoBytes, { filename: "band.png" }).expect(201);
  await a.lead.agent.post(`/api/cases/${kept.id}/verify`).send({}).expect(200);
  const ask = await a.lead.agent.post(`/api/cases/${other.id}/requests`).send({ text: "Which drying agent, and how much?" });
  await a.chemist.agent.patch(`/api/requests/${ask.body.id}`).send({ reply: "About 5 g sodium sulfate." }).expect(200);
  await a.lead.agent.post(`/api/cases/${dup.id}/merge`).send({ into: kept.id }).expect(200);
  await a.lead.agent.post("/api/advice").send({ caseId: kept.id, text: "For urea rags after couplings, filter the whole mixture first." }).expect(201);
  await a.owner.agent.post(`/api/cases/${other.id}/retire`).send({ code: "not-reproducible", reason: "Could not repeat it." }).expect(200);
  await a.lead.agent
    .post("/api/reference/overrides")
    .send({
      kind: "solvent-value",
      solventKey: "methylene chloride",
      field: "densityGPerMl20C",
      value: 1.318,
      source: "Supplier SDS, lot 4471, section 9",
      reason: "Our stabilised grade is lighter than the handbook value.",
    })
    .expect(201);

  const got = await download(a.lead.agent);
  source = got.doc;
  sourceText = got.text;
  sourceRecordsHeader = Number(got.headers["x-backup-records"]);
});
afterAll(async () => {
  await t.close();
});

describe("GET /api/backup", () => {
  it("holds every kind of record of the group, one per line, counted ahead in a header", () => {
    expect(source).toMatchObject({ format: "phasewise-group-backup", version: 1, group: { id: a.groupId } });
    expect(source.cases.map((c) => c.title).sort()).toEqual(["Duplicate of the urea rag", "Hazy ether layer", "Kept: urea rag after coupling"]);
    // 2 + 1 + 1 attempts, all on the case that remains or on the retired one
    expect(source.attempts).toHaveLength(4);
    expect(source.photos).toHaveLength(1);
    expect(source.requests).toHaveLength(1);
    expect(source.merges).toHaveLength(1);
    expect(source.advice).toHaveLength(1);
    expect(source.overrides).toHaveLength(1);
    // verify, request, request.answer, merge, merge.kept, advice.create, retire, override.create
    expect(source.audit.map((e) => e.action).sort()).toEqual(
      ["advice.create", "merge", "merge.kept", "override.create", "request", "request.answer", "retire", "verify"].sort(),
    );
    expect(source.members.map((m) => m.role).sort()).toEqual(["chemist", "lead", "owner"]);
    expect(source.people.map((p) => p.email).sort()).toEqual([a.chemist.email, a.lead.email, a.owner.email].sort());
    // No case carries its search vector or another group's id.
    expect(sourceText).not.toContain("searchVector");
    expect(sourceText).not.toContain('"groupId"');

    const records = BACKUP_TABLES.reduce((s, name) => s + source[name].length, 0);
    expect(sourceRecordsHeader).toBe(records);
    // every record opens a line of its own: the client's progress counts these
    const recordLines = sourceText.split("\n").filter((l) => l.startsWith("{") && !l.startsWith('{"format"'));
    expect(recordLines).toHaveLength(records);
  });

  it("reads in pages without changing a byte of the records", async () => {
    const chunks: string[] = [];
    await writeBackup(t.db, a.groupId, async (c) => void chunks.push(c), 1);
    const paged = JSON.parse(chunks.join("")) as BackupDocument;
    expect({ ...paged, exportedAt: "" }).toEqual({ ...source, exportedAt: "" });
  });

  it("is for the group's leads and owner", async () => {
    expect((await agentFor(t.app).get("/api/backup")).status).toBe(401);
    expect((await a.chemist.agent.get("/api/backup")).status).toBe(403);
    expect((await a.owner.agent.get("/api/backup")).status).toBe(200);
  });
});

/** A document with ids read as what they name, for comparing two backups of the same content. */
function canonical(doc: BackupDocument, emailOf: (email: string) => string) {
  const label = new Map<string, string>();
  for (const p of doc.people) label.set(p.id, `person:${emailOf(p.email)}`);
  const title = new Map(doc.cases.map((c) => [c.id, c.title]));
  for (const c of doc.cases) label.set(c.id, `case:${c.title}`);
  for (const x of doc.attempts) label.set(x.id, `attempt:${title.get(x.caseId)}#${x.position}`);
  for (const p of doc.photos) {
    label.set(p.id, `photo:${title.get(p.caseId)}:${p.sizeBytes}`);
    label.set(p.storageKey, "photo-file");
    label.set(p.thumbnailKey, "thumbnail-file");
  }
  for (const r of doc.requests) label.set(r.id, `request:${r.text}`);
  for (const m of doc.merges) label.set(m.id, `merge:${title.get(m.mergedId)}`);
  for (const n of doc.advice) label.set(n.id, `advice:${n.text}`);
  for (const o of doc.overrides) label.set(o.id, `override:${o.subject}`);
  for (const e of doc.audit) label.set(e.id, `audit:${e.action}:${e.createdAt}`);
  const read = (v: unknown): unknown => {
    if (typeof v === "string") return label.get(v) ?? v;
    if (Array.isArray(v)) return v.map(read);
    if (v && typeof v === "object") return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, read(x)]));
    return v;
  };
  const sorted = <T>(rows: T[]) => (read(rows) as unknown[]).map((r) => JSON.stringify(r)).sort();
  return {
    cases: sorted(doc.cases),
    attempts: sorted(doc.attempts),
    photos: sorted(doc.photos),
    followers: sorted(doc.followers),
    requests: sorted(doc.requests),
    merges: sorted(doc.merges),
    advice: sorted(doc.advice),
    overrides: sorted(doc.overrides),
    audit: sorted(doc.audit.filter((e) => e.action !== "backup.import")),
  };
}

describe("POST /api/backup/import", () => {
  let newGroupId: string;

  it("imports into an empty group with new ids, people matched by e-mail, and exports the same content again", async () => {
    // The chemist starts a new group (as its owner) and brings the lead in; the old owner is not a member.
    const created = await a.chemist.agent.post("/api/groups").send({ name: "Backup restore lab" });
    expect(created.status).toBe(201);
    newGroupId = created.body.id;
    await t.db.execute(sql`insert into member (id, organization_id, user_id, role, created_at) values (${crypto.randomUUID()}, ${newGroupId}, ${a.lead.userId}, 'lead', now())`);
    await a.chemist.agent.post(`/api/groups/${newGroupId}/activate`).send({}).expect(200);

    const res = await a.chemist.agent.post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(sourceText);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      groupId: newGroupId,
      imported: { cases: 3, attempts: 4, photos: 1, requests: 1, merges: 1, advice: 1, overrides: 1, audit: 8 },
      photosMissing: 0,
      peopleMatched: 2,
      peopleToImporter: 1,
    });

    await a.chemist.agent.post(`/api/groups/${newGroupId}/activate`).send({}).expect(200);
    const again = await download(a.chemist.agent);
    expect(again.doc.group.id).toBe(newGroupId);
    // Every record has a new id.
    const oldIds = new Set([...source.cases, ...source.attempts, ...source.photos, ...source.requests, ...source.advice, ...source.audit].map((r) => r.id));
    for (const r of [...again.doc.cases, ...again.doc.attempts, ...again.doc.photos, ...again.doc.requests, ...again.doc.advice, ...again.doc.audit]) {
      expect(oldIds.has(r.id)).toBe(false);
    }
    // The old owner is no member here: their retirement is credited to the importer.
    const asHere = (email: string) => (email === a.owner.email ? a.chemist.email : email);
    expect(canonical(again.doc, (e) => e)).toEqual(canonical(source, asHere));
    expect(again.doc.audit.find((e) => e.action === "backup.import")).toMatchObject({ actorId: a.chemist.userId });
  });

  it("leaves a working group: lists, photo bytes, advice, corrections and restores from the imported log", async () => {
    const cases = (await a.chemist.agent.get("/api/cases?includeRetired=true")).body.cases as { id: string; title: string }[];
    expect(cases.map((c) => c.title).sort()).toEqual(["Duplicate of the urea rag", "Hazy ether layer", "Kept: urea rag after coupling"]);
    const kept = (await a.chemist.agent.get(`/api/cases/${cases.find((c) => c.title.startsWith("Kept"))!.id}`)).body;
    expect(kept).toMatchObject({ verified: true, verifiedBy: a.lead.userId, authorId: a.chemist.userId });
    expect(kept.attempts.map((x: { remedyId: string }) => x.remedyId)).toEqual(["let-stand", "filter-pad", "saturated-brine"]);
    expect(kept.verifiedAttemptId).toBe(kept.attempts[1].id);
    const served = await a.chemist.agent.get(kept.photos[0].url).buffer(true);
    expect(served.status).toBe(200);
    expect((await sharp(served.body as Buffer).metadata()).width).toBe(16);

    const notes = (await a.chemist.agent.get("/api/advice")).body.notes;
    expect(notes).toHaveLength(1);
    expect(notes[0].sources.map((s: { id: string }) => s.id)).toEqual([kept.id]);
    // The group's DCM correction is in force here too: 1.318 g/mL instead of the handbook's 1.327.
    const layers = await a.chemist.agent.post("/api/layers/predict").send({ organic: [{ solvent: "DCM", volumeMl: 30 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20 });
    expect(layers.body.organicDensityGPerMl).toBe(1.318);

    // The imported merge entry still undoes the merge: the snapshot's ids were carried over.
    const log = (await a.lead.agent.post(`/api/groups/${newGroupId}/activate`).send({}), await a.lead.agent.get("/api/audit?action=merge")).body.entries;
    expect(log).toHaveLength(1);
    const undo = await a.lead.agent.post(`/api/audit/${log[0].id}/restore`).send({ version: "before" });
    expect(undo.status).toBe(200);
    const dup = cases.find((c) => c.title.startsWith("Duplicate"))!;
    expect((await a.lead.agent.get(`/api/cases/${dup.id}`)).body).toMatchObject({ mergedInto: null, retired: false });
    expect((await a.lead.agent.get(`/api/cases/${dup.id}`)).body.attempts).toHaveLength(1);
  });

  it("refuses a group that is not empty, a chemist, a stranger and a document that is not a backup", async () => {
    const refused = await a.chemist.agent.post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(sourceText);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("group_not_empty");

    const fresh = await groupWithRoles(t, "restore-target");
    expect((await fresh.chemist.agent.post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(sourceText)).status).toBe(403);
    expect((await agentFor(t.app).post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(sourceText)).status).toBe(401);
    const wrong = await fresh.lead.agent.post("/api/backup/import").send({ format: "something-else", version: 1 });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.format).toMatch(/not a Phasewise group backup/);
    const dangling = { ...source, attempts: [{ ...source.attempts[0]!, caseId: "no-such-case" }] };
    const bad = await fresh.lead.agent.post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(JSON.stringify(dangling));
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/does not hold/);
    // Nothing of the refused imports stayed behind.
    expect((await fresh.lead.agent.get("/api/cases?includeRetired=true")).body.cases).toHaveLength(0);
  });

  it("takes a backup larger than the API's 1 MB JSON limit, and counts photos whose files are elsewhere", async () => {
    const fresh = await groupWithRoles(t, "restore-large");
    const padded: BackupDocument = {
      ...source,
      cases: source.cases.map((c) => ({ ...c, searchText: `${c.searchText} ${"x".repeat(600_000)}` })),
      photos: source.photos.map((p) => ({ ...p, storageKey: "photos/00/00000000000000000000000000000000.png", thumbnailKey: "photos/00/00000000000000000000000000000000-thumb.webp" })),
    };
    const text = JSON.stringify(padded);
    expect(text.length).toBeGreaterThan(1024 * 1024);
    const res = await fresh.owner.agent.post("/api/backup/import").set("Content-Type", BACKUP_MEDIA_TYPE).send(text);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: { cases: 3, photos: 0 }, photosMissing: 1 });
    // people here: none of the backup's e-mails are members of this group → all three to the importer
    expect(res.body).toMatchObject({ peopleMatched: 0, peopleToImporter: 3 });
  });
});
