import {
  PRIOR_STRENGTH,
  isSimilar,
  ownGroupRecords,
  phBand,
  smoothedRate,
  troubleshoot,
  type EvidenceRecord,
  type RemedyId,
  type TroubleshootInput,
} from "../../knowledge/emulsion";

describe("phBand", () => {
  it.each([
    [0.5, "<2"],
    [1.99, "<2"],
    [2, "2-6"],
    [6, "2-6"],
    [6.5, "6-9"],
    [9, "6-9"],
    [11.5, "9-12"],
    [12, "9-12"],
    [12.01, ">12"],
    [14, ">12"],
  ])("pH %p is band %p", (ph, band) => {
    expect(phBand(ph)).toBe(band);
  });
});

describe("smoothedRate: posterior mean of a Beta(k·p₀, k·(1 − p₀)) prior, k = 4", () => {
  it("uses four pseudo-cases", () => {
    expect(PRIOR_STRENGTH).toBe(4);
  });
  it.each([
    // (s + 4·p₀) / (n + 4), by hand
    [0.5, 0, 0, 0.5],
    [0.2, 1, 1, (1 + 0.8) / 5], // 0.36
    [0.9, 0, 3, 3.6 / 7], // 0.514
    [0.1, 10, 10, (10 + 0.4) / 14], // 0.743
    [0.3, 2.5, 5, (2.5 + 1.2) / 9], // two cleared + one partly of five
  ])("prior %p, %p successes in %p tries → %p", (p0, s, n, expected) => {
    expect(smoothedRate(p0, s, n)).toBeCloseTo(expected, 10);
  });
});

/* A case of our own group: DCM over 1 M NaOH with a fatty acid, pH band ">12", soap first. */
const input: TroubleshootInput = {
  system: {
    organic: [{ solvent: "DCM", volumeMl: 50 }],
    aqueous: { solute: "NaOH", concentration: { value: 1, unit: "mol/L" }, volumeMl: 50 },
    temperatureC: 20,
  },
  seen: { emulsionFractionPct: 40 },
  known: { reagents: ["fatty-acid"] },
  components: [
    { name: "decanoic acid", kind: "acid", pKa: 4.9, logP: 4.1 },
    { name: "amide product", kind: "neutral", logP: 2.5 },
  ],
};
const record = (remedyId: RemedyId, outcome: EvidenceRecord["outcome"], groupId = "g-ours", extra: Partial<EvidenceRecord> = {}): EvidenceRecord => ({
  groupId,
  remedyId,
  outcome,
  solventFamily: "halogenated",
  phBand: ">12",
  causeCode: "surfactant-soap",
  ...extra,
});
const times = (n: number, r: EvidenceRecord) => Array.from({ length: n }, () => r);
const byId = (r: ReturnType<typeof troubleshoot>, id: RemedyId) => r.remedies.find((m) => m.id === id)!;
const rank = (r: ReturnType<typeof troubleshoot>, id: RemedyId) => r.remedies.findIndex((m) => m.id === id);

describe("group evidence in the ranking", () => {
  const plain = troubleshoot(input);
  const weakPrior = byId(plain, "chill-freeze-thaw").priorScore;
  const strong = plain.remedies[0]!; // the strongly curated leader

  it("leaves the curated ranking alone without evidence", () => {
    expect(strong.id).toBe("adjust-ph");
    expect(byId(plain, "chill-freeze-thaw").evidence).toBeUndefined();
  });

  it("one lucky case cannot lift a weak remedy above a strongly curated one", () => {
    const r = troubleshoot(input, { evidence: [record("chill-freeze-thaw", "cleared")], groupId: "g-ours" });
    const u = byId(r, "chill-freeze-thaw");
    expect(u.evidence).toEqual({ cleared: 1, tried: 1, smoothedRate: (1 + 4 * weakPrior) / 5 });
    expect(u.score).toBeCloseTo((1 + 4 * weakPrior) / 5, 3);
    expect(u.score).toBeLessThan(strong.score);
    expect(rank(r, "chill-freeze-thaw")).toBeGreaterThan(rank(r, "adjust-ph"));
    expect(u.reasons.join(" ")).toMatch(/cleared 1 of 1/);
  });

  it("many successes do raise it past well-fitting remedies", () => {
    const r = troubleshoot(input, { evidence: times(20, record("chill-freeze-thaw", "cleared")), groupId: "g-ours" });
    const u = byId(r, "chill-freeze-thaw");
    expect(u.score).toBeCloseTo((20 + 4 * weakPrior) / 24, 3);
    expect(u.score).toBeGreaterThan(byId(plain, "swirl-interface").score);
    expect(rank(r, "chill-freeze-thaw")).toBeLessThan(rank(r, "swirl-interface"));
  });

  it("repeated failures pull a curated favourite down", () => {
    const r = troubleshoot(input, { evidence: times(6, record("adjust-ph", "no-change")), groupId: "g-ours" });
    expect(byId(r, "adjust-ph").score).toBeCloseTo((0 + 4 * strong.priorScore) / 10, 3);
    expect(r.remedies[0]?.id).not.toBe("adjust-ph");
  });

  it("never uses another group's records", () => {
    const foreign = times(20, record("chill-freeze-thaw", "cleared", "g-theirs"));
    const r = troubleshoot(input, { evidence: foreign, groupId: "g-ours" });
    expect(byId(r, "chill-freeze-thaw").evidence).toBeUndefined();
    expect(byId(r, "chill-freeze-thaw").score).toBe(byId(plain, "chill-freeze-thaw").score);
    // without a group id, records from two groups are not blended at all
    const mixed = troubleshoot(input, { evidence: [...foreign, record("chill-freeze-thaw", "cleared")] });
    expect(byId(mixed, "chill-freeze-thaw").evidence).toBeUndefined();
    expect(ownGroupRecords([...foreign, record("chill-freeze-thaw", "cleared")], "g-ours")).toHaveLength(1);
  });

  it("only counts similar systems: same solvent family, pH band and cause", () => {
    const dissimilar = [
      record("chill-freeze-thaw", "cleared", "g-ours", { solventFamily: "ester" }),
      record("chill-freeze-thaw", "cleared", "g-ours", { phBand: "6-9" }),
      record("chill-freeze-thaw", "cleared", "g-ours", { causeCode: "fine-solids" }),
    ];
    const r = troubleshoot(input, { evidence: dissimilar, groupId: "g-ours" });
    expect(byId(r, "chill-freeze-thaw").evidence).toBeUndefined();
    expect(isSimilar(record("chill-freeze-thaw", "cleared", "g-ours", { causeCode: undefined }), { solventFamily: "halogenated", phBand: ">12", causeCode: "surfactant-soap" })).toBe(true);
  });

  it("attaches the group's notes for the matching remedy and system", () => {
    const r = troubleshoot(input, {
      groupNotes: [
        { remedyId: "filter-pad", text: "Our 3 cm pad on the 60 mL sinter works for these", solventFamily: "halogenated" },
        { remedyId: "filter-pad", text: "For ester work-ups only", solventFamily: "ester" },
      ],
    });
    expect(byId(r, "filter-pad").groupNotes?.map((n) => n.text)).toEqual(["Our 3 cm pad on the 60 mL sinter works for these"]);
  });
});
