import fs from "node:fs";
import path from "node:path";
import request from "supertest";
import sharp from "sharp";
import { sql } from "drizzle-orm";
import type { Express } from "express";
import { ROLE_MATRIX, allowedFor, type RecordKind, type RouteRule } from "../../server/role-matrix";
import type { GroupRole } from "../../server/roles";
import { couplingCase, createCase } from "./case-helpers";
import { ORIGIN, groupWithRoles, signUp, startTestApp, uniqueEmail, type Agent, type TestApp } from "./harness";

/*
 * Walks every API route the app registers (read from Express's router stack, so a new route
 * without a rule in server/role-matrix.ts fails here) with no session, a signed-in account in no
 * group, a member of another group, and each role of the group that owns the records, and
 * asserts the matrix: 401 without a session, 403 below the role (or not the author, where only
 * the author or a lead may act), 404 for another group's record.
 */

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: unknown;
}

/** Every method + path the app answers, from its router stack; better-auth's catch-all is its own. */
function registeredRoutes(app: Express): string[] {
  const out = new Set<string>();
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const full = prefix + layer.route.path;
        if (full.includes("*")) continue;
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== "_all") out.add(`${method.toUpperCase()} ${full}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (typeof layer.rawPath === "string" && layer.rawPath !== "/" ? layer.rawPath : ""));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, "");
  return [...out];
}

const key = (r: Pick<RouteRule, "method" | "path">) => `${r.method} ${r.path}`;
/** Path parameters that name a group's record (a solvent key or remedy id belongs to no group). */
const GROUP_RECORDS = new Set<RecordKind>(["group", "member", "case", "attempt", "photo", "plan", "override", "audit", "invitation", "advice", "request"]);

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;
let loner: Awaited<ReturnType<typeof signUp>>;
/** a second chemist of group A who wrote none of the records */
let bystander: Awaited<ReturnType<typeof signUp>>;
const records = {} as Record<RecordKind, string>;

/**
 * Valid bodies where a route validates before it looks the record up, so the author check or the
 * group scope (not validation) answers. Merging a case into itself is refused (400) by design:
 * the walk must not merge its own fixture away.
 */
const validBodies = (): Record<string, object> => ({
  "PATCH /api/cases/:id": { notes: "Interface sharpened after 10 min." },
  "POST /api/cases/:id/attempts": { remedyId: "let-stand", outcome: "no-change" },
  "PATCH /api/cases/:id/attempts/:attemptId": { note: "Timed with the hood clock." },
  "PATCH /api/plans/:id": { title: "Acid strip, revised" },
  "PATCH /api/requests/:id": { reply: "About 5 g sodium sulfate." },
  "POST /api/cases/:id/retire": { code: "superseded", reason: "A better fix is logged." },
  "POST /api/cases/:id/merge": { into: records.case },
  "POST /api/cases/:id/requests": { text: "Was the aqueous layer checked for product?" },
  "PATCH /api/advice/:id": { text: "In this group, filter urea rags through a pad of diatomaceous earth first." },
  "DELETE /api/reference/overrides/:id": { reason: "The supplier sheet was superseded." },
});

async function addMember(label: string, role: GroupRole) {
  const who = await signUp(t.app, label);
  const memberId = crypto.randomUUID();
  await t.db.execute(sql`insert into member (id, organization_id, user_id, role, created_at) values (${memberId}, ${a.groupId}, ${who.userId}, ${role}, now())`);
  return { ...who, memberId };
}

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "rm-a");
  b = await groupWithRoles(t, "rm-b");
  loner = await signUp(t.app, "rm-loner");
  bystander = await addMember("rm-bystander", "chemist");
  const spare = await addMember("rm-spare", "chemist");

  const c = await createCase(a.chemist.agent, couplingCase({ attempts: [{ remedyId: "filter-pad", outcome: "cleared" }] }));
  const detail = await a.chemist.agent.get(`/api/cases/${c.id}`);
  const png = await sharp({ create: { width: 24, height: 16, channels: 3, background: "#7799bb" } }).png().toBuffer();
  const photo = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", png, { filename: "band.png", contentType: "image/png" });
  const plan = await a.chemist.agent.post("/api/plans").send({
    title: "Acid strip",
    input: {
      organic: { solvent: "ethyl acetate", volumeMl: 50 },
      components: [{ name: "amine A", kind: "base", pKa: 9.5, partitionCoefficient: 40, amountMmol: 4 }],
      washes: [{ aqueous: { solute: "HCl", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 20, repeats: 2 }],
      temperatureC: 20,
    },
  });
  const override = await a.lead.agent.post("/api/reference/overrides").send({
    kind: "solvent-value",
    solventKey: "toluene",
    field: "boilingPointC",
    value: 110.6,
    source: "Supplier SDS, section 9",
    reason: "Matches our supplier's sheet.",
  });
  const audit = await a.lead.agent.get("/api/audit?entity=reference-override");
  const invitation = await a.lead.agent.post(`/api/groups/${a.groupId}/invitations`).send({ email: uniqueEmail("rm-invitee"), role: "chemist" });
  await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({});
  const advice = await a.lead.agent.post("/api/advice").send({ caseId: c.id, text: "In this group, filter urea rags through a pad first." });
  const ask = await a.lead.agent.post(`/api/cases/${c.id}/requests`).send({ text: "How much pad, and was the filtrate clear?" });

  Object.assign(records, {
    group: a.groupId,
    member: spare.memberId,
    case: c.id,
    attempt: detail.body.attempts[0].id,
    photo: photo.body.id,
    plan: plan.body.id,
    override: override.body.id,
    audit: audit.body.entries[0].id,
    invitation: invitation.body.id,
    advice: advice.body.id,
    request: ask.body.id,
    solvent: "dichloromethane",
    solute: "sodium-chloride",
    remedy: "let-stand",
  });
  for (const [kind, id] of Object.entries(records)) if (!id) throw new Error(`fixture ${kind} was not created`);
});
afterAll(async () => {
  await t.close();
});

function urlFor(rule: RouteRule): string {
  return rule.path.replace(/:(\w+)/g, (_m, name: string) => {
    const kind = rule.params?.[name];
    if (!kind) throw new Error(`${key(rule)}: the matrix does not say what :${name} names`);
    return encodeURIComponent(records[kind]);
  });
}

async function call(agent: Agent | null, rule: RouteRule): Promise<number> {
  const url = urlFor(rule);
  const m = rule.method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
  const base = agent ? agent[m](url) : request(t.app)[m](url).set("Origin", ORIGIN);
  const res = rule.method === "GET" ? await base : await base.send(validBodies()[key(rule)] ?? {});
  return res.status;
}

/** Let through by the role guard: neither 401 nor 403, and no server fault. */
function expectAllowed(status: number, who: string, rule: RouteRule) {
  expect({ route: key(rule), who, status: status === 401 || status === 403 || status >= 500 ? status : "allowed" }).toEqual({
    route: key(rule),
    who,
    status: "allowed",
  });
}
function expectStatus(status: number, wanted: number, who: string, rule: RouteRule) {
  expect({ route: key(rule), who, status }).toEqual({ route: key(rule), who, status: wanted });
}

describe("the role matrix", () => {
  it("has one rule for every registered API route, and no rule for a route that does not exist", () => {
    const registered = registeredRoutes(t.app).filter((r) => r.split(" ")[1]!.startsWith("/api/"));
    const ruled = new Set(ROLE_MATRIX.map(key));
    expect(registered.filter((r) => !ruled.has(r))).toEqual([]);
    expect([...ruled].filter((r) => !registered.includes(r))).toEqual([]);
    expect(ruled.size).toBe(ROLE_MATRIX.length);
  });

  it("is written down in DEVELOPERS.md, one row per route", () => {
    const guide = fs.readFileSync(path.join(__dirname, "..", "..", "DEVELOPERS.md"), "utf8");
    expect(ROLE_MATRIX.filter((r) => !guide.includes(`\`${key(r)}\``)).map(key)).toEqual([]);
  });

  it.each(ROLE_MATRIX.map((r) => [key(r), r] as const))("%s", async (_name, rule) => {
    const recordInUrl = Object.values(rule.params ?? {}).some((k) => GROUP_RECORDS.has(k));
    // No session.
    const anonymous = await call(null, rule);
    if (rule.guard === "public") expectAllowed(anonymous, "anonymous", rule);
    else expectStatus(anonymous, 401, "anonymous", rule);

    // Signed in, in no group.
    const alone = await call(loner.agent, rule);
    if (rule.guard === "public" || rule.guard === "user") expectAllowed(alone, "no group", rule);
    else if (rule.guard === "group") expectStatus(alone, 403, "no group", rule);
    else if (rule.guard === "invitee") expectStatus(alone, 403, "no group", rule);
    else expectStatus(alone, 404, "no group", rule);

    // The owner of another group: group A's records do not exist for them.
    const outsider = await call(b.owner.agent, rule);
    if (rule.guard === "public" || rule.guard === "user" || (rule.guard === "group" && !recordInUrl)) expectAllowed(outsider, "other group", rule);
    else if (rule.guard === "invitee") expectStatus(outsider, 403, "other group", rule);
    else expectStatus(outsider, 404, "other group", rule);

    // Below the role first, then a chemist who is not the author, then the allowed roles
    // weakest first (an allowed call may change or remove the record).
    const roles: GroupRole[] = ["chemist", "lead", "owner"];
    for (const role of roles.filter((r) => !allowedFor(rule, r))) {
      expectStatus(await call(a[role].agent, rule), 403, role, rule);
    }
    if (rule.own) expectStatus(await call(bystander.agent, rule), 403, "chemist, not the author", rule);
    for (const role of roles.filter((r) => allowedFor(rule, r))) {
      expectAllowed(await call(a[role].agent, rule), role, rule);
    }
  });
});
