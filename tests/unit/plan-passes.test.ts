import {
  compareOneVersusSplit,
  fractionLeftAfterPasses,
  fractionLeftCurve,
  passesForRecovery,
} from "../../knowledge/plan/passes";
import { KnowledgeInputError } from "../../knowledge/types";

describe("multiple extraction: fraction left = (Vs / (Vs + D·Vp))^n (Nichols, Organic Chemistry Laboratory Techniques, ch. 4)", () => {
  it.each([
    // Nichols' worked comparison: D = 3, 100 mL aqueous, 1 × 90 mL vs 3 × 30 mL → 73.0 % vs 85.4 % extracted
    [3, 100, 90, 3, 0.73, 0.854],
    // same comparison with D = 1 (domain brief §5.3): 47.4 % vs 54.5 %
    [1, 100, 90, 3, 0.474, 0.545],
  ])("D = %d, %d mL, %d mL total in %d portions", (D, vs, vTotal, n, single, split) => {
    const c = compareOneVersusSplit(D, vs, vTotal, n);
    expect(c.singleRecovery).toBeCloseTo(single, 3);
    expect(c.splitRecovery).toBeCloseTo(split, 3);
    expect(c.portionVolumeMl).toBe(vTotal / n);
    expect(c.gainPercentPoints).toBeCloseTo((split - single) * 100, 1);
  });

  it("matches the closed form after n passes", () => {
    // hand: (100 / (100 + 3 × 30))^3 = (100/190)^3 = 0.145794
    expect(fractionLeftAfterPasses({ distributionRatio: 3, sourceVolumeMl: 100, portionVolumeMl: 30 }, 3)).toBeCloseTo(0.145794, 6);
    expect(fractionLeftAfterPasses({ distributionRatio: 3, sourceVolumeMl: 100, portionVolumeMl: 30 }, 0)).toBe(1);
  });
});

describe("passes for a target recovery", () => {
  it("needs 8 passes of 30 mL for 99 % at D = 3 from 100 mL", () => {
    // hand: n = ceil(ln 0.01 / ln(100/190)) = ceil(7.17) = 8; recovery 1 − (100/190)^8 = 0.99413
    const r = passesForRecovery({ distributionRatio: 3, sourceVolumeMl: 100, portionVolumeMl: 30 }, 0.99);
    expect(r.passes).toBe(8);
    expect(r.recovery).toBeCloseTo(1 - (100 / 190) ** 8, 10);
    expect(r.totalPortionVolumeMl).toBe(240);
  });

  it("stops exactly at the target when it is reached on a whole pass", () => {
    // 0.1 left per pass (D·Vp = 9·Vs): 99.9 % needs exactly 3 passes
    const r = passesForRecovery({ distributionRatio: 9, sourceVolumeMl: 100, portionVolumeMl: 100 }, 0.999);
    expect(r.passes).toBe(3);
  });

  it("says when the target cannot be reached", () => {
    expect(passesForRecovery({ distributionRatio: 0, sourceVolumeMl: 100, portionVolumeMl: 30 }, 0.9).passes).toBeNull();
    expect(() => passesForRecovery({ distributionRatio: 3, sourceVolumeMl: 100, portionVolumeMl: 30 }, 1)).toThrow(KnowledgeInputError);
    expect(() => fractionLeftAfterPasses({ distributionRatio: 3, sourceVolumeMl: 0, portionVolumeMl: 30 }, 1)).toThrow(KnowledgeInputError);
  });

  it("draws the remaining-fraction curve from pass 0", () => {
    const curve = fractionLeftCurve({ distributionRatio: 3, sourceVolumeMl: 100, portionVolumeMl: 30 }, 3);
    expect(curve.map((p) => p.pass)).toEqual([0, 1, 2, 3]);
    expect(curve[3]!.fractionLeft).toBeCloseTo((100 / 190) ** 3, 10);
  });
});
