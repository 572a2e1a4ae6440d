import { chooseFunnel } from "../../knowledge/plan/funnel";
import { KnowledgeInputError } from "../../knowledge/types";

describe("separatory-funnel choice: smallest standard size at most three-quarters full (common practice)", () => {
  it.each([
    [40, 60],
    [45, 60], // exactly 3/4 of 60 mL
    [46, 125],
    [70, 125],
    [93.75, 125],
    [94, 250],
    [375, 500],
    [750, 1000],
    [751, 2000],
    [1500, 2000],
  ])("%d mL → %d mL funnel", (total, funnel) => {
    const c = chooseFunnel(total);
    expect(c.funnelMl).toBe(funnel);
    expect(c.batches).toBe(1);
    expect(c.fillFraction).toBeLessThanOrEqual(0.75 + 1e-9);
  });

  it("warns about pressure in funnels over 1 L (Prudent Practices)", () => {
    expect(chooseFunnel(751).warnings.map((w) => w.code)).toContain("funnel-large-pressure");
    expect(chooseFunnel(750).warnings).toEqual([]);
  });

  it("splits beyond the largest funnel into equal batches", () => {
    // 4000 mL over 1500 mL per 2 L funnel → 3 batches of 1333 mL
    const c = chooseFunnel(4000);
    expect(c.batches).toBe(3);
    expect(c.batchVolumeMl).toBeCloseTo(4000 / 3, 6);
    expect(c.funnelMl).toBe(2000);
    expect(c.warnings.map((w) => w.code)).toEqual(["funnel-batches", "funnel-large-pressure"]);
  });

  it("refuses a non-positive volume", () => {
    expect(() => chooseFunnel(0)).toThrow(KnowledgeInputError);
  });
});
