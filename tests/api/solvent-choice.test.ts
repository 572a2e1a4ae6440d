import request from "supertest";
import { startTestApp, type TestApp } from "./harness";

/*
 * POST /api/solvents/rank and GET /api/solvents/:key/substitutes. The facts checked come from
 * outside the ranking code:
 *  - densities at 20 °C (CRC, "Physical constants of organic compounds"): dichloromethane 1.3266,
 *    chloroform 1.489, ethyl acetate 0.9003, toluene 0.8669 g/mL; water 0.9982 (Kell 1975).
 *  - normal boiling points (CRC): ethyl acetate 77.1 °C, isopropyl acetate 88.6 °C, toluene 110.6 °C.
 *  - halogenated: any C–Cl bond in the formula; peroxide formers: ethers with α-hydrogens (Clark 2001 classes).
 *  - replacement table for dichloromethane (Alfonsi et al., Green Chem. 2008, 10, 31): ethyl acetate,
 *    MTBE, toluene, 2-MeTHF, CPME, isopropyl acetate.
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

interface Ranked {
  key: string;
  meetsConstraints: boolean;
  failures: string[];
  reasons: string[];
  boilingPointC: number;
  densityGPerMl: number | null;
  halogenated: boolean;
  peroxideClass: string | null;
  guideCategory: string;
}

const rank = (body: unknown) => request(t.app).post("/api/solvents/rank").send(body as object);

describe("POST /api/solvents/rank", () => {
  it("keeps only solvents denser than water when the organic layer must be the bottom one", async () => {
    const res = await rank({ organicLayer: "bottom" });
    expect(res.status).toBe(200);
    const meeting = (res.body.solvents as Ranked[]).filter((s) => s.meetsConstraints);
    expect(meeting.map((s) => s.key)).toEqual(expect.arrayContaining(["dichloromethane", "chloroform"]));
    expect(meeting.map((s) => s.key)).not.toContain("ethyl-acetate");
    for (const s of meeting) expect(s.densityGPerMl!).toBeGreaterThan(0.9982);
    const ethylAcetate = (res.body.solvents as Ranked[]).find((s) => s.key === "ethyl-acetate")!;
    expect(ethylAcetate.failures.join(" ")).toMatch(/on the top/);
    // those that meet every constraint come first
    const firstFailing = (res.body.solvents as Ranked[]).findIndex((s) => !s.meetsConstraints);
    expect((res.body.solvents as Ranked[]).slice(firstFailing).every((s) => !s.meetsConstraints)).toBe(true);
  });

  it("applies no-halogen, no-peroxide-former, a boiling range and a guide category together, with reasons", async () => {
    const res = await rank({ organicLayer: "top", noHalogen: true, noPeroxideFormer: true, bpMinC: 60, bpMaxC: 100, minGuideCategory: "recommended" });
    expect(res.status).toBe(200);
    const meeting = (res.body.solvents as Ranked[]).filter((s) => s.meetsConstraints);
    expect(meeting.map((s) => s.key)).toEqual(expect.arrayContaining(["ethyl-acetate", "isopropyl-acetate"]));
    for (const s of meeting) {
      expect(s.halogenated).toBe(false);
      expect(s.peroxideClass).toBeNull();
      expect(s.boilingPointC).toBeGreaterThanOrEqual(60);
      expect(s.boilingPointC).toBeLessThanOrEqual(100);
      expect(s.guideCategory).toBe("recommended");
      expect(s.reasons.some((r) => r.startsWith("selection guide"))).toBe(true);
    }
    const toluene = (res.body.solvents as Ranked[]).find((s) => s.key === "toluene")!;
    expect(toluene.failures).toContain("boils at 110.6 °C, above 100 °C");
    const ether = (res.body.solvents as Ranked[]).find((s) => s.key === "diethyl-ether")!;
    expect(ether.failures.some((f) => f.startsWith("peroxide former"))).toBe(true);
    expect(res.body.sourceTitles.length).toBeGreaterThan(0);
  });

  it("compares against a dense aqueous phase when asked (saturated brine, 1.197 g/mL at 26 % w/w, CRC)", async () => {
    const res = await rank({ aqueous: { solute: "brine", concentration: "saturated" }, candidates: ["DCM", "EtOAc"] });
    expect(res.status).toBe(200);
    const dcm = (res.body.solvents as Ranked[]).find((s) => s.key === "dichloromethane")!;
    expect(dcm.reasons.find((r) => r.startsWith("denser"))).toMatch(/by 0\.1[23]\d g\/mL/); // 1.3266 − ≈1.20
    expect(res.body.solvents).toHaveLength(2);
  });

  it.each([
    ["an organic layer in the middle", { organicLayer: "middle" }, "organicLayer"],
    ["a boiling point as text", { bpMinC: "warm" }, "bpMinC"],
    ["an unknown guide category", { minGuideCategory: "excellent" }, "minGuideCategory"],
    ["an unknown aqueous phase", { aqueous: { solute: "unobtainium" } }, "aqueous.solute"],
    ["an unknown candidate", { candidates: ["EtOAc", "unobtainium"] }, "candidates[1]"],
  ])("answers 400 for %s", async (_label, body, field) => {
    const res = await rank(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });
});

describe("GET /api/solvents/:key/substitutes", () => {
  it("offers the replacement table's substitutes for dichloromethane with the layer-order flip", async () => {
    const res = await request(t.app).get("/api/solvents/dichloromethane/substitutes");
    expect(res.status).toBe(200);
    expect(res.body.solvent.key).toBe("dichloromethane");
    const keys = res.body.substitutes.map((s: { key: string }) => s.key);
    expect(keys).toEqual(expect.arrayContaining(["ethyl-acetate", "toluene", "2-methyltetrahydrofuran", "isopropyl-acetate"]));
    const etoac = res.body.substitutes.find((s: { key: string }) => s.key === "ethyl-acetate");
    expect(etoac.basis).toBe("replacement-table");
    expect(etoac.caveats.join(" ")).toMatch(/layer order flips/);
    expect(etoac.caveats.join(" ")).toMatch(/boils at 77\.1 °C vs 39\.6 °C/);
    expect(etoac.caveats.join(" ")).toMatch(/carries more water/);
    expect(res.body.checklist.length).toBeGreaterThan(3);
    expect(res.body.sourceTitles.map((s: { key: string }) => s.key)).toEqual(res.body.sources);
  });

  it("takes a CAS number (75-09-2 is dichloromethane)", async () => {
    const res = await request(t.app).get("/api/solvents/75-09-2/substitutes");
    expect(res.status).toBe(200);
    expect(res.body.solvent.key).toBe("dichloromethane");
  });

  it("answers 404 with suggestions for an unknown key and 400 for water", async () => {
    const missing = await request(t.app).get("/api/solvents/dichloromethan/substitutes");
    expect(missing.status).toBe(404);
    expect(missing.body.error.suggestions).toContain("dichloromethane");
    const water = await request(t.app).get("/api/solvents/water/substitutes");
    expect(water.status).toBe(400);
    expect(water.body.error.fields.solvent).toMatch(/aqueous phase/);
  });
});
