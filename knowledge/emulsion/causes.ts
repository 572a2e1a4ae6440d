import type { CauseCode, EmulsionCause } from "./model";

/** Why funnels emulsify, with what gives each cause away. Written for the diagnosis questions. */
export const CAUSES: EmulsionCause[] = [
  {
    code: "surfactant-soap",
    title: "Soap or surfactant holding the droplets apart",
    mechanism:
      "An amphiphile sits on the droplet surfaces and lowers the interfacial tension: a greasy carboxylic acid turned into its salt by base, a greasy amine protonated by acid, a phase-transfer catalyst, detergent, lipid or protein. Charged films repel each other, so droplets do not merge.",
    signs: [
      "milky, opaque band that does not shrink with time",
      "a long-chain acid in basic water, or a long-chain amine in acidic water",
      "quaternary ammonium or phosphonium salt, detergent, lipid, natural-product or protein extract in the mixture",
      "foam that lingers after shaking",
    ],
    sources: ["emulsion-teaching-module", "vogel-5th-from-memory", "common-practice"],
  },
  {
    code: "fine-solids",
    title: "Fine solids collecting at the interface",
    mechanism:
      "Particles wetted partly by each liquid lodge in the interface and armour the droplets (a particle-stabilised, 'rag' layer). Typical after quenching metal reagents (aluminium, titanium, tin, zinc, magnesium, iron or copper hydroxides), with palladium black, or with urea by-products of carbodiimide couplings.",
    signs: [
      "specks, flocs or a grey, white or brown scum in the band",
      "a metal reagent, metal salt or heterogeneous catalyst was used",
      "a gelatinous layer that coats the glass",
    ],
    sources: ["epa-3510c-from-memory", "lah-quench-teaching-page", "common-practice"],
  },
  {
    code: "close-densities",
    title: "Layer densities too close to settle",
    mechanism:
      "Settling speed is proportional to the density difference (Stokes' law), so below about 0.05 g/mL droplets creep; near zero the layers can hang mixed or swap places. Anisole against water, chlorobenzene or 1,2-dichloroethane against strong brine, and dichloromethane diluted with a light solvent are usual examples.",
    signs: [
      "the layer check reports a small density difference",
      "the interface drifts, or the layers seem to change place",
      "a salty or concentrated aqueous phase under or over a chlorinated solvent",
    ],
    sources: ["stokes-settling", "common-practice"],
  },
  {
    code: "viscous-crude",
    title: "Viscous or very concentrated crude",
    mechanism:
      "A thick organic phase (tars, oils, polymers, concentrated product) slows droplet movement in proportion to its viscosity, so even large droplets settle slowly; cold makes it worse.",
    signs: [
      "the organic layer is syrupy, dark or tarry",
      "little solvent for the amount of crude",
      "the funnel or the room is cold",
    ],
    sources: ["stokes-settling", "anderson-process-from-memory"],
  },
  {
    code: "miscible-cosolvent",
    title: "Water-miscible co-solvent still in the mixture",
    mechanism:
      "Reaction solvents such as THF, methanol, ethanol, acetonitrile, acetone, dioxane, DMF, DMSO or NMP dissolve in both layers, raise their mutual solubility and lower the interfacial tension; the split turns diffuse, or a third liquid layer appears.",
    signs: [
      "the reaction was run in a water-miscible solvent and not stripped",
      "one phase, a vague interface, or three liquid layers",
      "the organic layer is larger or smaller than the solvent added",
    ],
    sources: ["anderson-process-from-memory", "common-practice"],
  },
  {
    code: "chlorinated-base",
    title: "Chlorinated solvent over basic water",
    mechanism:
      "Dichloromethane or chloroform against basic water emulsifies often. Likely reasons: soaps form at high pH, hydroxides precipitate, and with the chlorinated layer at the bottom, particles whose density lies between the two layers stay at the interface.",
    signs: [
      "dichloromethane, chloroform or another halogenated solvent with aqueous pH above about 9",
      "a thick band just above the lower (organic) layer",
    ],
    sources: ["common-practice"],
  },
  {
    code: "entrained-gas",
    title: "Gas bubbles carrying droplets",
    mechanism:
      "Fine bubbles (carbon dioxide from carbonate or bicarbonate meeting acid, or air beaten in by vigorous stirring) float droplets and sediment back into the interface and keep it churned.",
    signs: [
      "bubbles or foam rising through the band",
      "bicarbonate or carbonate wash of an acidic mixture",
      "pressure when venting",
    ],
    sources: ["common-practice"],
  },
  {
    code: "hazy-organic",
    title: "Hazy organic layer after separation",
    mechanism:
      "Micro-droplets of water stay suspended in the separated organic layer, or dissolved water comes out as the solution cools; solvents that dissolve a lot of water (ethyl acetate, 2-MeTHF, diethyl ether, butanol) do this most.",
    signs: [
      "the layers separated but the organic layer is cloudy",
      "the solvent is one that takes up several % of water",
      "haze that appears on cooling",
    ],
    sources: ["nichols-techniques-from-memory", "epa-1664-white-paper"],
  },
];

export function causeByCode(code: CauseCode): EmulsionCause {
  const cause = CAUSES.find((c) => c.code === code);
  if (!cause) throw new Error(`No cause ${code}`);
  return cause;
}
