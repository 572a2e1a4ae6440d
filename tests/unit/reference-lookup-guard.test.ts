import { findSolute, findSolvent, sameCompoundShape } from "../../knowledge/reference";

// Each query below names a real compound that is NOT in the tables; a typo allowance must never
// turn it into a neighbour (a bisulfite wash is not a bicarbonate wash).
describe("fuzzy look-up never swaps one compound for another", () => {
  it.each(["pentanol", "heptanol", "1-propanol", "2-butanol", "methyl acetate", "dimethyl ether", "ethylbenzene", "p-xylene", "m-xylene"])(
    "solvent %s is not resolved",
    (q) => {
      expect(findSolvent(q)).toBeUndefined();
    },
  );

  it.each(["NaHSO3", "sodium sulfite", "sodium hydride", "sodium chlorite"])("solute %s is not resolved", (q) => {
    expect(findSolute(q)).toBeUndefined();
  });

  it.each([
    ["dichloromethan", "dichloromethane"],
    ["ethyl acetat", "ethyl-acetate"],
    ["toluen", "toluene"],
    ["diethyl ehter", "diethyl-ether"],
    ["acetonitril", "acetonitrile"],
  ])("a genuine slip %s still finds %s", (q, key) => {
    expect(findSolvent(q)?.key).toBe(key);
  });

  it.each([
    ["sodium bicarbonat", "sodium-bicarbonate"],
    ["sodium chlorid", "sodium-chloride"],
  ])("a genuine slip %s still finds %s", (q, key) => {
    expect(findSolute(q)?.key).toBe(key);
  });

  it("compares word by word", () => {
    expect(sameCompoundShape("sodium hydride", "sodium hydroxide")).toBe(false);
    expect(sameCompoundShape("sodium chlorid", "sodium chloride")).toBe(true);
  });
});
