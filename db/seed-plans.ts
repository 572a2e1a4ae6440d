import type { PlanDocument } from "../knowledge/contracts/plans";
import type { SeedHook } from "./seed";
import { plans } from "./schema";

/*
 * Two saved plans of the fictional Larchmere Process Group (invented work-ups for the demo):
 * the lead's reductive-amination strip, which a chemist may read and copy but not change, and a
 * chemist's own ester work-up.
 */
const AMINATION: PlanDocument = {
  organic: { solvent: "ethyl-acetate", volumeMl: 60 },
  components: [
    { name: "secondary amine product", kind: "base", pKa: 10.6, partitionCoefficient: 45, amountMmol: 5 },
    { name: "aldehyde left over", kind: "neutral", partitionCoefficient: 30, amountMmol: 0.6 },
    { name: "acetic acid", kind: "acid", pKa: 4.756, partitionCoefficient: 0.9, amountMmol: 4 },
  ],
  washes: [
    { aqueous: { solute: "hydrochloric-acid", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 30, repeats: 2 },
    { aqueous: { solute: "sodium-chloride", concentration: "saturated" }, volumeMl: 20 },
  ],
  temperatureC: 20,
  recovery: { component: "secondary amine product", wash: 0, reagent: { solute: "sodium-hydroxide", concentration: { value: 2, unit: "mol/L" } } },
  evaporation: { vaporTemperatureC: 30 },
};

const ESTER: PlanDocument = {
  organic: { solvent: "mtbe", volumeMl: 40 },
  components: [
    { name: "methyl ester product", kind: "neutral", logP: 2.6, amountMmol: 8 },
    { name: "DMAP", kind: "base", pKa: 9.7, partitionCoefficient: 3, amountMmol: 0.8 },
  ],
  washes: [
    { aqueous: { solute: "ammonium-chloride", concentration: "saturated" }, volumeMl: 20, repeats: 2 },
    { aqueous: { solute: "sodium-chloride", concentration: "saturated" }, volumeMl: 20 },
  ],
  temperatureC: 20,
};

export const seedPlans: SeedHook = async ({ db, groupId, users }) => {
  await db.insert(plans).values([
    {
      id: crypto.randomUUID(),
      groupId,
      authorId: users.lead,
      title: "Reductive amination: amine into acid, back out with base",
      notes: "The amine goes into the HCl extracts and the aldehyde stays in the ethyl acetate. Basify the combined extracts in ice, then take the amine back into fresh solvent.",
      input: AMINATION,
    },
    { id: crypto.randomUUID(), groupId, authorId: users.chemist, title: "Ester work-up after DMAP coupling", notes: "", input: ESTER },
  ]);
};
