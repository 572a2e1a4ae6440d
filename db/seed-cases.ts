import { createCaseBody, type CreateCaseBody } from "../knowledge/contracts/cases";
import { insertCase } from "../server/case-records";
import type { SeedHook } from "./seed";

/*
 * Demo case log of the fictional Larchmere Process Group: a year of work-ups on its own
 * intermediates (the "LPG-" numbers are invented). Chemistry and layer physics are realistic;
 * names, numbers and outcomes are made up for the demo.
 */

type Who = "owner" | "lead" | "chemist";
interface DemoCase {
  author: Who;
  daysAgo: number;
  verified?: boolean;
  body: CreateCaseBody;
}

const DEMO_CASES: DemoCase[] = [
  {
    author: "chemist",
    daysAgo: 3,
    verified: true,
    body: {
      title: "White rag layer after the LPG-114 amide coupling wash",
      system: {
        organic: [{ solvent: "DCM", volumeMl: 150 }],
        aqueous: { solute: "sat. NaHCO3", concentration: "saturated", volumeMl: 100 },
        temperatureC: 21,
        scale: { productG: 6.2, mmol: 24, funnelMl: 500 },
      },
      tags: ["amide-coupling", "urea-byproduct"],
      components: [
        { name: "LPG-114 morpholine amide", role: "product", kind: "neutral" },
        { name: "carbodiimide-derived urea", role: "by-product", kind: "neutral" },
      ],
      causes: ["fine-solids"],
      observedBottom: "organic",
      seen: { kind: "rag-with-solids", emulsionFractionPct: 15, solids: true, colour: "off-white", shaking: "vigorous" },
      notes: "Urea by-product crashed out at the interface as a fluffy white band. Vented often: bicarbonate releases CO2 from any acid left over.",
      status: "resolved",
      finalOutcome: "Clean split after filtering the whole mixture; product all in the DCM layer by TLC.",
      recovery: { massG: 5.9, percent: 95 },
      attempts: [
        { remedyId: "let-stand", minutes: 15, outcome: "no-change", note: "Band did not shrink." },
        { remedyId: "filter-pad", amount: "2 cm diatomaceous earth in a 60 mL sinter", minutes: 10, outcome: "cleared", note: "Rinsed the pad with 20 mL DCM." },
      ],
    },
  },
  {
    author: "lead",
    daysAgo: 12,
    verified: true,
    body: {
      title: "Grey aluminium gel after the LPG-122 hydride reduction quench",
      system: {
        organic: [
          { solvent: "THF", volumeMl: 80 },
          { solvent: "MTBE", volumeMl: 200 },
        ],
        aqueous: { solute: "Rochelle salt", concentration: { value: 20, unit: "%w/w" }, volumeMl: 150 },
        temperatureC: 20,
        scale: { productG: 9.5, funnelMl: 1000 },
      },
      tags: ["hydride-reduction", "aluminium", "metal-salts"],
      causes: ["fine-solids", "miscible-cosolvent"],
      observedBottom: "aqueous",
      seen: { kind: "rag-with-solids", emulsionFractionPct: 40, solids: true, colour: "grey", shaking: "normal" },
      notes: "Quenched slowly at 0 °C behind a shield (hydrogen evolves; keep ignition sources away). Aluminium salts formed a grey gel through most of the aqueous layer.",
      status: "resolved",
      finalOutcome: "Two clear layers after an hour of stirring with the tartrate solution.",
      recovery: { percent: 88 },
      attempts: [
        { remedyId: "saturated-brine", amount: "50 mL", minutes: 10, outcome: "no-change" },
        { remedyId: "tartrate-chelation", amount: "150 mL 20 % tartrate, stirred in the flask", minutes: 60, outcome: "cleared", note: "Stirred vigorously in a flask, not the funnel." },
      ],
    },
  },
  {
    author: "chemist",
    daysAgo: 20,
    body: {
      title: "One cloudy phase: THF reaction diluted with ethyl acetate",
      system: {
        organic: [
          { solvent: "THF", volumeMl: 60 },
          { solvent: "ethyl acetate", volumeMl: 100 },
        ],
        aqueous: { solute: "water", volumeMl: 80 },
        temperatureC: 22,
      },
      tags: ["acid-base-wash"],
      causes: ["miscible-cosolvent"],
      observedBottom: "aqueous",
      seen: { kind: "whole-volume-cloudy", emulsionFractionPct: 80, solids: false, cloudyOrganic: true },
      notes: "Too much THF carried over from the reaction; the layers barely separated.",
      status: "resolved",
      finalOutcome: "Removed the THF on the rotary evaporator, took the residue up in fresh ethyl acetate, clean wash.",
      attempts: [
        { remedyId: "saturated-brine", amount: "40 mL", minutes: 10, outcome: "partly", note: "Salting out pulled some THF back into the organic layer." },
        { remedyId: "strip-cosolvent", minutes: 35, outcome: "cleared" },
      ],
    },
  },
  {
    author: "lead",
    daysAgo: 34,
    body: {
      title: "Milky band in the toluene phase-transfer alkylation",
      system: {
        organic: [{ solvent: "toluene", volumeMl: 250 }],
        aqueous: { solute: "NaOH", concentration: { value: 25, unit: "%w/w" }, volumeMl: 120 },
        temperatureC: 25,
        scale: { productG: 18, funnelMl: 1000 },
      },
      tags: ["phase-transfer-catalyst", "scale-up"],
      components: [{ name: "tetraalkylammonium bromide catalyst", role: "reagent" }],
      causes: ["surfactant-soap"],
      observedBottom: "aqueous",
      seen: { kind: "milky-band", emulsionFractionPct: 25, solids: false, colour: "milky white", shaking: "vigorous" },
      notes: "The quaternary ammonium catalyst stabilises the band. Concentrated caustic: face shield and suitable gloves.",
      status: "resolved",
      finalOutcome: "Diluting the caustic layer broke the band; next time swirl rather than shake.",
      attempts: [
        { remedyId: "let-stand", minutes: 30, outcome: "no-change" },
        { remedyId: "solid-salt", amount: "10 g NaCl", minutes: 10, outcome: "partly" },
        { remedyId: "dilute-aqueous", amount: "100 mL water", minutes: 10, outcome: "cleared" },
      ],
    },
  },
  {
    author: "chemist",
    daysAgo: 48,
    body: {
      title: "Soapy emulsion before acidifying the LPG-131 ester hydrolysis",
      system: {
        organic: [{ solvent: "EtOAc", volumeMl: 120 }],
        aqueous: { solute: "NaOH", concentration: { value: 1, unit: "mol/L" }, volumeMl: 100, ph: 12.6 },
        temperatureC: 20,
      },
      tags: ["ester-hydrolysis", "acid-base-wash"],
      components: [{ name: "LPG-131 carboxylic acid", role: "product", kind: "acid", pKa: 4.6 }],
      causes: ["surfactant-soap"],
      observedBottom: "aqueous",
      seen: { kind: "milky-band", emulsionFractionPct: 30, solids: false, colour: "pale yellow" },
      notes: "The long-chain acid's sodium salt acts as a soap at high pH.",
      status: "resolved",
      finalOutcome: "Acidified to pH 2 with 1 M HCl, added slowly with swirling; clean split and the acid moved into the ethyl acetate.",
      recovery: { percent: 91 },
      attempts: [
        { remedyId: "saturated-brine", amount: "30 mL", minutes: 10, outcome: "partly" },
        { remedyId: "adjust-ph", amount: "1 M HCl to pH 2", minutes: 5, outcome: "cleared" },
      ],
    },
  },
  {
    author: "owner",
    daysAgo: 60,
    body: {
      title: "Layers swapped: DCM on top of saturated potassium carbonate",
      system: {
        organic: [{ solvent: "dichloromethane", volumeMl: 100 }],
        aqueous: { solute: "K2CO3", concentration: "saturated", volumeMl: 100 },
        temperatureC: 20,
      },
      tags: ["acid-base-wash"],
      causes: [],
      observedBottom: "aqueous",
      seen: { kind: "none" },
      notes: "Saturated carbonate is denser than DCM, so the organic layer floated. A drop test confirmed it before anything was drained.",
      status: "resolved",
      finalOutcome: "No emulsion; logged for the surprise in layer order.",
      attempts: [],
    },
  },
  {
    author: "chemist",
    daysAgo: 75,
    body: {
      title: "Magnesium salts at the interface after the Grignard quench",
      system: {
        organic: [
          { solvent: "2-MeTHF", volumeMl: 150 },
          { solvent: "diethyl ether", volumeMl: 50 },
        ],
        aqueous: { solute: "NH4Cl", concentration: "saturated", volumeMl: 120 },
        temperatureC: 18,
      },
      tags: ["grignard-quench", "metal-salts"],
      causes: ["fine-solids"],
      observedBottom: "aqueous",
      seen: { kind: "rag-with-solids", emulsionFractionPct: 10, solids: true, colour: "white" },
      notes: "Quench was exothermic; added the chloride solution dropwise with ice cooling. Diethyl ether is extremely flammable.",
      status: "resolved",
      finalOutcome: "A little dilute acid dissolved the magnesium hydroxide.",
      attempts: [
        { remedyId: "swirl-interface", minutes: 5, outcome: "no-change" },
        { remedyId: "adjust-ph", amount: "10 mL 1 M HCl", minutes: 5, outcome: "cleared" },
      ],
    },
  },
  {
    author: "lead",
    daysAgo: 90,
    body: {
      title: "Black specks holding the toluene layer after the cross-coupling",
      system: {
        organic: [{ solvent: "toluene", volumeMl: 200 }],
        aqueous: { solute: "water", volumeMl: 100 },
        temperatureC: 22,
      },
      tags: ["cross-coupling", "metal-salts"],
      causes: ["fine-solids"],
      observedBottom: "aqueous",
      seen: { kind: "rag-with-solids", emulsionFractionPct: 8, solids: true, colour: "black" },
      notes: "Finely divided palladium at the interface.",
      status: "resolved",
      attempts: [{ remedyId: "filter-pad", amount: "3 cm diatomaceous earth", minutes: 15, outcome: "cleared" }],
    },
  },
  {
    author: "chemist",
    daysAgo: 110,
    body: {
      title: "Hazy ethyl acetate layer after the brine wash",
      system: {
        organic: [{ solvent: "ethyl acetate", volumeMl: 150 }],
        aqueous: { solute: "brine", concentration: "saturated", volumeMl: 50 },
        temperatureC: 20,
      },
      tags: ["acid-base-wash"],
      causes: ["hazy-organic"],
      observedBottom: "aqueous",
      seen: { kind: "hazy-organic", cloudyOrganic: true, solids: false },
      notes: "Separated fine, but the organic layer stayed cloudy with dispersed water.",
      status: "resolved",
      attempts: [{ remedyId: "dry-organic", amount: "10 g anhydrous Na2SO4", minutes: 15, outcome: "cleared" }],
    },
  },
  {
    author: "chemist",
    daysAgo: 130,
    body: {
      title: "Foam after the bicarbonate wash of the acid chloride quench",
      system: {
        organic: [{ solvent: "DCM", volumeMl: 120 }],
        aqueous: { solute: "bicarb", concentration: "saturated", volumeMl: 120 },
        temperatureC: 20,
      },
      tags: ["acid-base-wash"],
      causes: ["entrained-gas"],
      observedBottom: "organic",
      seen: { kind: "foam", foamOrBubbles: true, emulsionFractionPct: 20 },
      notes: "CO2 from leftover acid: swirled open before stoppering, vented after every inversion.",
      status: "resolved",
      attempts: [{ remedyId: "gentle-vacuum-degas", minutes: 10, outcome: "cleared", note: "Swirled the open funnel until gas stopped." }],
    },
  },
  {
    author: "lead",
    daysAgo: 6,
    body: {
      title: "Whole-volume cloudiness in the leaf extract",
      system: {
        organic: [{ solvent: "ethyl acetate", volumeMl: 200 }],
        aqueous: { solute: "water", volumeMl: 200 },
        temperatureC: 20,
      },
      tags: ["natural-product"],
      causes: ["surfactant-soap", "fine-solids"],
      observedBottom: "aqueous",
      seen: { kind: "whole-volume-cloudy", emulsionFractionPct: 70, solids: true, colour: "green-brown" },
      notes: "Plant saponins and fine debris; still open.",
      status: "open",
      attempts: [
        { remedyId: "saturated-brine", amount: "60 mL", minutes: 20, outcome: "partly" },
        { remedyId: "centrifuge", amount: "4 × 50 mL tubes, sealed, rated rotor", minutes: 10, outcome: "partly", note: "Flammable solvent: only in a rotor rated for it." },
      ],
    },
  },
  {
    author: "chemist",
    daysAgo: 150,
    body: {
      title: "Third layer after the DMSO reaction quench",
      system: {
        organic: [{ solvent: "MTBE", volumeMl: 100 }],
        aqueous: { solute: "water", volumeMl: 60 },
        temperatureC: 20,
      },
      tags: ["acid-base-wash"],
      causes: ["miscible-cosolvent"],
      observedBottom: "aqueous",
      seen: { kind: "three-layers", thirdLayer: true, emulsionFractionPct: 20 },
      notes: "Not enough water for the DMSO carried over; an oily middle layer held product.",
      status: "abandoned",
      finalOutcome: "Re-ran the work-up with five volumes of water per volume of DMSO.",
      attempts: [
        { remedyId: "dilute-aqueous", amount: "60 mL water", minutes: 10, outcome: "partly" },
        { remedyId: "little-alcohol", amount: "3 mL isopropanol", minutes: 5, outcome: "worse" },
      ],
    },
  },
];

export const seedCases: SeedHook = async ({ db, groupId, users }) => {
  const now = Date.now();
  await db.transaction(async (tx) => {
    for (const c of DEMO_CASES) {
      const when = new Date(now - c.daysAgo * 86_400_000);
      const body = createCaseBody.parse({ ...c.body, occurredAt: when.toISOString() });
      await insertCase(tx, { groupId, authorId: users[c.author], body, now: when, verifiedBy: c.verified ? users.lead : undefined });
    }
  });
};
