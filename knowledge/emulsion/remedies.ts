import type { Remedy, RemedyAmounts, RemedyId } from "./model";

/** Rounds an amount the way it would be measured at the bench. */
export function benchAmount(x: number): number {
  if (x < 1) return Math.round(x * 10) / 10;
  if (x < 10) return Math.round(x * 2) / 2;
  if (x < 100) return Math.round(x);
  return Math.round(x / 5) * 5;
}

const n = benchAmount;
const lowerLayer = (a: RemedyAmounts): string =>
  a.organicIsBottom === null ? "lower layer" : a.organicIsBottom ? "lower (organic) layer" : "lower (aqueous) layer";

const SDS = "follow the SDS and local rules.";

/**
 * The remedy catalogue. Fit weights (0–1) say how well a remedy answers each cause when that
 * cause is certain; they are curated judgements drawn from the sources listed on each entry.
 */
export const REMEDIES: Remedy[] = [
  {
    id: "let-stand",
    title: "Let it stand",
    mechanism:
      "Gravity and time: droplets settle and merge at a speed set by droplet size, density difference and viscosity (Stokes' law). Many bands clear on their own.",
    fits: {
      causes: {
        "close-densities": 0.5,
        "viscous-crude": 0.5,
        "entrained-gas": 0.55,
        "surfactant-soap": 0.35,
        "chlorinated-base": 0.35,
        "fine-solids": 0.2,
        "miscible-cosolvent": 0.2,
        "hazy-organic": 0.15,
      },
      conditions: ["always the first move", "less useful once 30 minutes or more have passed", "costly with acid- or base-sensitive products"],
    },
    steps: (a) => [
      "Vent, loosen or cover the stopper and clamp the funnel upright; do not shake again.",
      "Mark the band on the glass and wait 10 minutes; if it is shrinking, give it up to an hour.",
      `Drain the ${lowerLayer(a)} as it clears, stopping at the band.`,
    ],
    minutes: { min: 5, max: 60 },
    risks: [
      "acid- or base-sensitive products degrade while they wait",
      "volatile solvent evaporates if the funnel is left open",
      "some bands need hours or overnight",
    ],
    scale: "any",
    evidence: "literature",
    sources: ["epa-1664-white-paper", "emulsion-teaching-module", "vogel-5th-from-memory", "stokes-settling"],
    cautions: [],
    tier: 1,
  },
  {
    id: "swirl-interface",
    title: "Swirl gently or stir the band",
    mechanism:
      "Slow motion breaks the rigid film around droplets, frees droplets stuck to the glass and brings neighbours together so they merge, without making new small droplets.",
    fits: {
      causes: {
        "surfactant-soap": 0.55,
        "chlorinated-base": 0.6,
        "viscous-crude": 0.5,
        "entrained-gas": 0.4,
        "close-densities": 0.3,
        "fine-solids": 0.3,
        "miscible-cosolvent": 0.15,
      },
      conditions: ["thin bands and droplets on the walls", "any scale"],
    },
    steps: () => [
      "Take the stopper out and swirl the funnel slowly in a flat circle five or six times.",
      "Tap the glass at the band, or draw a glass rod slowly through the band a few times.",
      "Let stand 2–5 minutes and look again; do not shake.",
    ],
    minutes: { min: 1, max: 5 },
    risks: ["shaking instead of swirling makes the band worse"],
    scale: "any; slow agitation plays the same part in a reactor",
    evidence: "literature",
    sources: ["emulsion-teaching-module", "epa-3510c-from-memory", "vogel-5th-from-memory"],
    cautions: [],
    tier: 1,
  },
  {
    id: "saturated-brine",
    title: "Add saturated brine",
    mechanism:
      "Raises ionic strength: salts organics and partly miscible solvents out of the water, thins the charged layer around droplets so they merge, and raises the aqueous density.",
    fits: {
      causes: {
        "surfactant-soap": 0.55,
        "miscible-cosolvent": 0.6,
        "close-densities": 0.5,
        "hazy-organic": 0.45,
        "chlorinated-base": 0.2,
        "fine-solids": 0.15,
        "entrained-gas": 0.1,
      },
      conditions: [
        "best when the organic is the upper layer: brine widens the density gap",
        "when the organic is denser than water but not much denser than brine (about 1.0–1.25 g/mL) the layers can swap or hang isodense",
      ],
    },
    steps: (a) => [
      `Add ${n(a.brineMl.min)}–${n(a.brineMl.max)} mL saturated aqueous NaCl (20–30 % of the ${n(a.aqueousMl)} mL aqueous layer).`,
      "Invert gently two or three times, venting each time, then let stand.",
      "One more portion if the band shrinks; stop if it does not.",
      ...(a.organicIsBottom ? ["The organic is the lower layer here: read the 'after' densities before adding more."] : []),
    ],
    minutes: { min: 2, max: 15 },
    risks: [
      "raises the aqueous density: can swap or stall the layers when the organic is the lower one",
      "adds volume",
      "can salt the product out as a solid at the interface",
      "reagents that react with chloride",
    ],
    scale: "any",
    evidence: "literature",
    sources: ["emulsion-teaching-module", "vogel-5th-from-memory", "epa-1664-white-paper"],
    cautions: [],
    tier: 2,
  },
  {
    id: "solid-salt",
    title: "Dissolve solid salt in the aqueous layer",
    mechanism:
      "The same salting-out as brine without adding volume; crystals sinking through the band also break it mechanically.",
    fits: {
      causes: {
        "surfactant-soap": 0.5,
        "miscible-cosolvent": 0.6,
        "close-densities": 0.4,
        "hazy-organic": 0.2,
        "chlorinated-base": 0.2,
        "fine-solids": 0.1,
      },
      conditions: ["when the funnel is nearly full", "same density caution as brine, stronger because the salt is more concentrated"],
    },
    steps: (a) => [
      `Weigh ${n(a.saltG)} g NaCl: about half of the ${n(a.saltSaturationG)} g that would saturate this ${n(a.aqueousMl)} mL aqueous layer.`,
      "Add it in three portions through a powder funnel, swirling gently until each dissolves.",
      "Let stand 5 minutes; do not go on to saturation.",
    ],
    minutes: { min: 3, max: 15 },
    risks: [
      "undissolved salt blocks the stopcock",
      "raises the aqueous density more than brine: can swap the layers",
      "solubility is lower in water that already holds sodium salts",
    ],
    scale: "any",
    evidence: "literature",
    sources: ["extraction-teaching-page", "epa-1664-white-paper", "crc-solubility-from-memory"],
    cautions: [],
    tier: 2,
  },
  {
    id: "more-organic",
    title: "Add more organic solvent",
    mechanism:
      "Dilutes the organic phase: lower viscosity and less surface-active solute per volume, and a larger continuous phase that takes up material stuck at the interface. Adding the denser (or lighter) solvent already present steers the density gap.",
    fits: {
      causes: {
        "viscous-crude": 0.8,
        "close-densities": 0.55,
        "chlorinated-base": 0.45,
        "surfactant-soap": 0.3,
        "fine-solids": 0.2,
        "miscible-cosolvent": 0.2,
      },
      conditions: ["concentrated or thick crude", "when the funnel has room", "compute the new density before mixing solvents"],
    },
    steps: (a) => [
      `Add ${n(a.extraOrganicMl)} mL ${a.extraOrganicSolventName} (about half the organic volume).`,
      "Invert gently once or twice with venting, then let stand.",
      ...(a.funnelMl ? [`Keep the funnel at most three-quarters full (${n(a.funnelMl * 0.75)} mL); split into two funnels if needed.`] : []),
    ],
    minutes: { min: 3, max: 15 },
    risks: [
      "more solvent to evaporate and dispose of",
      "mixing solvents of different density can swap the layers",
    ],
    scale: "any, within the funnel's room",
    evidence: "literature",
    sources: ["anderson-process-from-memory", "common-practice"],
    cautions: [],
    tier: 3,
  },
  {
    id: "dilute-aqueous",
    title: "Dilute the aqueous layer with water",
    mechanism:
      "Dissolves salts that have crashed out at the interface, thins a concentrated aqueous phase and lowers its density, and pulls DMF, DMSO or methanol out of the organic layer.",
    fits: {
      causes: {
        "miscible-cosolvent": 0.45,
        "close-densities": 0.4,
        "fine-solids": 0.3,
        "viscous-crude": 0.25,
      },
      conditions: [
        "helps a too-dense aqueous phase under a chlorinated organic",
        "hurts when the organic floats: the density gap shrinks",
        "the opposite of brine: use it only when the aqueous is too concentrated",
      ],
    },
    steps: (a) => [
      `Add ${n(a.waterMl)} mL water (about half the aqueous volume).`,
      "Invert gently with venting; let stand.",
      "Keep the aqueous layer for a back-extraction: more product stays in a larger aqueous volume.",
    ],
    minutes: { min: 3, max: 15 },
    risks: ["more product lost to the aqueous layer", "more waste", "can make a low-salt emulsion worse"],
    scale: "any, within the funnel's room",
    evidence: "common-practice",
    sources: ["common-practice", "anderson-process-from-memory"],
    cautions: [],
    tier: 3,
  },
  {
    id: "little-alcohol",
    title: "Add a little alcohol",
    mechanism:
      "A short-chain alcohol crowds the emulsifier off the interface and knocks down foam, so the film weakens and droplets merge.",
    fits: {
      causes: { "surfactant-soap": 0.45, "entrained-gas": 0.35, "chlorinated-base": 0.3, "viscous-crude": 0.15 },
      conditions: ["foamy or soapy bands", "not with a co-solvent problem: it adds to it", "not with acid chlorides or anhydrides present"],
    },
    steps: (a) => [
      `Add ${n(a.alcoholMl.min)}–${n(a.alcoholMl.max)} mL ethanol, 2-propanol or 1-butanol dropwise onto the band.`,
      "Swirl slowly; do not shake.",
      "Stop at the upper amount: more alcohol carries water and product across.",
    ],
    minutes: { min: 2, max: 10 },
    risks: [
      "raises mutual solubility: water and polar impurities in the organic, product in the aqueous",
      "reacts with acid chlorides and anhydrides; transesterification under base",
    ],
    scale: "small to medium",
    evidence: "literature",
    sources: ["extraction-teaching-page", "vogel-5th-from-memory"],
    cautions: [],
    tier: 2,
  },
  {
    id: "filter-pad",
    title: "Filter through diatomaceous earth or glass wool",
    mechanism:
      "Removes the fine particles that armour a particle-stabilised band; the porous bed also makes droplets merge as they pass.",
    fits: {
      causes: {
        "fine-solids": 0.95,
        "chlorinated-base": 0.75,
        "surfactant-soap": 0.3,
        "hazy-organic": 0.3,
        "viscous-crude": 0.15,
      },
      conditions: ["visible specks, scum or a dirty rag layer", "after metal-reagent quenches", "gravity through glass wool for volatile solvents"],
    },
    steps: (a) => [
      `Pack a 1–2 cm pad of diatomaceous earth on a sintered funnel (or a glass-wool plug in a powder funnel for gravity filtration) and wet it with ${a.mainSolventName}.`,
      "Pour the whole contents, both layers and the band, through the pad; use gentle vacuum only with a higher-boiling solvent.",
      `Rinse the pad with ${n(a.rinseMl)} mL ${a.mainSolventName}, return the filtrate to a clean funnel and let it separate.`,
      "Keep the pad until the product has been found (TLC or LC of a pad rinse).",
    ],
    minutes: { min: 10, max: 30 },
    risks: [
      "product held on the pad or in the solids",
      "vacuum strips volatile solvent and can draw gas back in",
      "fine solids clog the pad or pass through",
    ],
    scale: "lab to kilo-lab",
    evidence: "literature",
    sources: ["epa-3510c-from-memory", "extraction-teaching-page", "lah-quench-teaching-page"],
    cautions: ["Spent Pd/C or Raney nickel on a pad can ignite once sucked dry: keep it wet; " + SDS],
    tier: 3,
  },
  {
    id: "centrifuge",
    title: "Centrifuge (small volumes)",
    mechanism:
      "Multiplies the effective gravity hundreds to thousands of times, so settling that would take hours takes minutes.",
    fits: {
      causes: {
        "surfactant-soap": 0.6,
        "fine-solids": 0.6,
        "close-densities": 0.6,
        "viscous-crude": 0.45,
        "chlorinated-base": 0.45,
        "entrained-gas": 0.3,
      },
      conditions: ["up to a few hundred mL", "protein or biological mixtures", "solvent-resistant capped tubes"],
    },
    steps: (a) => [
      `Split the mixture into ${a.tubes50Ml} capped glass, polypropylene or fluoropolymer tubes (about 40 mL each) and balance them in opposite pairs.`,
      "Spin 5 minutes at about 1000–3000 × g.",
      "Pipette off the upper layer, or recombine the separated layers in a clean funnel.",
    ],
    minutes: { min: 10, max: 25 },
    risks: [
      "polycarbonate tubes are attacked by chlorinated solvents and ketones",
      "uncapped or unbalanced tubes",
      "product split over many tubes",
    ],
    scale: "about 1–50 mL per tube; impractical above about 500 mL",
    maxTotalMl: 500,
    evidence: "literature",
    sources: ["epa-3510c-from-memory", "vogel-5th-from-memory", "tube-resistance-from-memory"],
    cautions: ["Flammable solvents only in a centrifuge rated for them, in capped balanced tubes; " + SDS],
    tier: 4,
  },
  {
    id: "adjust-ph",
    title: "Adjust the pH",
    mechanism:
      "Turns an ionised emulsifier into its neutral form, which dissolves in the organic layer and stops acting as soap: acidify a carboxylate, basify an ammonium salt. It can also redissolve amphoteric hydroxides.",
    fits: {
      causes: { "surfactant-soap": 0.9, "chlorinated-base": 0.8, "fine-solids": 0.3 },
      conditions: [
        "only after checking where the product goes at the new pH",
        "acidify soaps from greasy acids in basic water; basify greasy amines in acidic water",
      ],
    },
    steps: (a) => [
      "Check where each component goes at the new pH first (component line below).",
      "Drain everything into an open beaker or flask, stir and cool in an ice bath.",
      a.phTarget !== null && a.phReagent
        ? `Add ${a.phReagent} dropwise to pH ${a.phTarget} by paper${a.phReagentMl !== null ? ` (about ${n(a.phReagentMl)} mL by calculation)` : ""}.`
        : "Add dilute acid or base dropwise to the chosen pH, checking with paper.",
      "When gas and warmth have stopped, return to the funnel, swirl gently and let stand.",
    ],
    minutes: { min: 5, max: 20 },
    risks: [
      "the product may move into the other layer",
      "acid- or base-sensitive groups",
      "carbon dioxide from carbonate or bicarbonate",
      "heat from neutralising strong acid or base",
    ],
    scale: "any",
    evidence: "literature",
    sources: ["epa-1664-white-paper", "nichols-techniques-from-memory", "henderson-hasselbalch"],
    cautions: ["Neutralise in an open, cooled vessel, never a stoppered funnel; vent often; " + SDS],
    tier: 3,
  },
  {
    id: "warm-bath",
    title: "Warm gently",
    mechanism: "Lower viscosity and a weaker interfacial film: droplets move and merge faster.",
    fits: {
      causes: { "viscous-crude": 0.7, "entrained-gas": 0.35, "surfactant-soap": 0.2 },
      conditions: ["only solvents boiling well above the bath", "never in a closed funnel"],
    },
    steps: (a) => [
      "Drain into an open flask; never warm a closed funnel.",
      `Warm in a water bath at ${n(a.bathC)} °C with swirling for 10–20 minutes; try a 5 mL aliquot first.`,
      "Return to the funnel once near room temperature.",
    ],
    minutes: { min: 10, max: 30 },
    risks: [
      "pressure or boiling with low-boiling solvents",
      "mutual solubility rises with temperature",
      "heat-sensitive products",
    ],
    scale: "small (water bath) to plant (jacket)",
    evidence: "common-practice",
    sources: ["common-practice", "prudent-practices-2011"],
    cautions: ["No flames or hot plates near flammable vapour; keep the bath well below the boiling point; " + SDS],
    tier: 3,
  },
  {
    id: "chill-freeze-thaw",
    title: "Cool, or freeze and thaw",
    mechanism:
      "Ice crystals growing in the aqueous droplets tear the interfacial films; a frozen aqueous layer also lets the organic layer be poured off.",
    fits: {
      causes: { "surfactant-soap": 0.3, "hazy-organic": 0.15, "viscous-crude": 0.1 },
      conditions: ["stubborn small-scale bands", "not when the product crystallises in the cold"],
    },
    steps: () => [
      "Drain into a thick-walled flask or bottle.",
      "Freeze the aqueous part in a freezer or an ice–salt bath, then pour off the liquid organic layer.",
      "Or thaw slowly at room temperature and separate again in the funnel.",
    ],
    minutes: { min: 30, max: 120 },
    risks: ["product or water crystallising", "cold makes viscous crudes worse", "glass cracks in deep-cold baths"],
    scale: "small",
    evidence: "anecdotal",
    sources: ["common-practice"],
    cautions: ["Deep-cold baths crack thin glass and burn skin: insulated gloves; " + SDS],
    tier: 3,
  },
  {
    id: "ultrasound",
    title: "Short ultrasound bath",
    mechanism:
      "Low-power ultrasound can cluster droplets and knock out bubbles; high power does the opposite and emulsifies.",
    fits: {
      causes: { "entrained-gas": 0.35, "surfactant-soap": 0.2, "close-densities": 0.1 },
      conditions: ["vials and small flasks only", "low confidence: occasionally used"],
    },
    steps: () => [
      "Move up to 50 mL into a vial or small flask.",
      "Stand it in an ultrasonic bath for 1–2 minutes at low power.",
      "Look at once; stop if the band grows.",
    ],
    minutes: { min: 2, max: 5 },
    risks: ["can make the emulsion worse", "warms the sample"],
    scale: "vials; up to about 50 mL",
    maxTotalMl: 50,
    evidence: "anecdotal",
    sources: ["common-practice"],
    cautions: ["Do not sonicate sealed vessels of volatile solvent; " + SDS],
    tier: 3,
  },
  {
    id: "strip-cosolvent",
    title: "Remove the water-miscible co-solvent",
    mechanism:
      "Taking out THF, alcohols, acetonitrile, acetone or dioxane restores two sharp phases; high-boiling DMF, DMSO or NMP are washed out with water or 5 % LiCl instead.",
    fits: {
      causes: { "miscible-cosolvent": 1 },
      conditions: ["only when a miscible co-solvent is present", "ideally before the funnel, next time"],
    },
    steps: (a) => [
      "Drain both layers and the band into a round-bottomed flask.",
      "THF, methanol, ethanol, acetonitrile, acetone or dioxane: evaporate under reduced pressure (test ethers for peroxides first).",
      `DMF, DMSO or NMP: do not strip; dilute with 5–10 volumes of water, or wash the organic layer 3–5 times with ${n(a.washMl)} mL 5 % aqueous LiCl.`,
      `Take the residue up in ${n(a.organicMl)} mL ${a.mainSolventName} and ${n(a.aqueousMl)} mL water and separate again.`,
    ],
    minutes: { min: 15, max: 40 },
    risks: ["volatile products evaporate too", "heat-sensitive products", "bumping and foaming"],
    scale: "any",
    evidence: "literature",
    sources: ["anderson-process-from-memory", "common-practice"],
    cautions: ["Peroxides concentrate when ethers are evaporated: test THF or dioxane first; " + SDS],
    tier: 4,
  },
  {
    id: "dry-organic",
    title: "Dry the hazy organic layer",
    mechanism: "An anhydrous salt takes up suspended and dissolved water; a brine wash first removes most of it.",
    fits: {
      causes: { "hazy-organic": 1 },
      conditions: ["after the layers have been separated", "not for visible water droplets: separate those first"],
    },
    steps: (a) => [
      "Separate any visible droplets or water layer first; wash once with brine if the solvent carries much water.",
      ...(a.dissolvedWaterG !== null
        ? [`Water-saturated, ${n(a.organicMl)} mL ${a.mainSolventName} holds about ${n(a.dissolvedWaterG)} g water.`]
        : []),
      `Add anhydrous MgSO4 (fast) or Na2SO4 (slower, neutral) in portions, about ${n(a.dryingAgentG)} g to start, swirling until fresh powder stays free-flowing.`,
      "Filter or decant, and rinse the solid with a little solvent.",
    ],
    minutes: { min: 5, max: 20 },
    risks: [
      "MgSO4 is mildly Lewis-acidic and holds polar products",
      "Na2SO4 stops working above about 32 °C",
      "haze from fine solids needs filtering, not drying",
    ],
    scale: "any",
    evidence: "literature",
    sources: ["nichols-techniques-from-memory", "epa-1664-white-paper", "sodium-sulfate-hydrate-from-memory"],
    cautions: [],
    tier: 2,
  },
  {
    id: "phase-separator-paper",
    title: "Pass through phase-separator paper",
    mechanism:
      "Hydrophobic paper lets the organic phase through and holds water back, so the filtrate comes out separated and dry.",
    fits: {
      causes: { "hazy-organic": 0.65, "close-densities": 0.2, "chlorinated-base": 0.2 },
      conditions: ["best when the organic is the lower layer", "small volumes", "surfactants or alcohols can wet the paper"],
    },
    steps: (a) => [
      "Fold a hydrophobic phase-separator paper into a funnel over a clean flask; do not wet it with water.",
      a.organicIsBottom === false
        ? "Drain most of the lower aqueous layer first, then pour the rest through the paper."
        : "Pour or drain the mixture onto the paper; the organic runs through and the water stays behind.",
      `Rinse the paper with a few mL of ${a.mainSolventName}.`,
    ],
    minutes: { min: 3, max: 10 },
    risks: ["wetting agents let water through", "limited capacity", "a little solvent stays in the paper"],
    scale: "up to a few hundred mL",
    maxTotalMl: 500,
    evidence: "common-practice",
    sources: ["common-practice"],
    cautions: [],
    tier: 2,
  },
  {
    id: "tartrate-chelation",
    title: "Tartrate wash for aluminium or titanium",
    mechanism:
      "Tartrate binds aluminium (and titanium) and holds it in the water as a soluble complex, so the gelatinous hydroxide that armours the band dissolves.",
    fits: {
      causes: { "fine-solids": 0.5 },
      conditions: ["after aluminium hydride, alkylaluminium, aluminium chloride or titanium alkoxide reagents"],
    },
    steps: (a) => [
      `Add ${n(a.chelatorMl)} mL saturated aqueous sodium potassium tartrate.`,
      "Stir vigorously in an open flask, not the funnel, until two clear layers form (30 minutes to a few hours).",
      "Return to the funnel and separate; filter through diatomaceous earth if flocs remain.",
    ],
    minutes: { min: 30, max: 180 },
    risks: ["slow", "adds aqueous volume"],
    scale: "any",
    evidence: "literature",
    sources: ["lah-quench-teaching-page", "fieser-lah-from-memory"],
    cautions: [],
    tier: 3,
  },
  {
    id: "copper-ammonia-wash",
    title: "Ammonia or EDTA wash for copper",
    mechanism:
      "Ammonia or EDTA binds copper as a soluble, deep-blue complex, which takes copper salts out of the interface into the water.",
    fits: {
      causes: { "fine-solids": 0.4 },
      conditions: ["after copper-mediated or copper-catalysed reactions"],
    },
    steps: (a) => [
      `Wash with ${n(a.washMl)} mL saturated aqueous NH4Cl with about a tenth of its volume of concentrated aqueous ammonia, or 0.1 M aqueous disodium EDTA.`,
      "Swirl and invert gently; repeat until the wash is no longer blue.",
    ],
    minutes: { min: 5, max: 20 },
    risks: ["the ammonia wash is basic", "amine-like products can follow the copper"],
    scale: "any",
    evidence: "common-practice",
    sources: ["common-practice"],
    cautions: ["Handle concentrated ammonia in the hood; " + SDS],
    tier: 3,
  },
  {
    id: "gentle-vacuum-degas",
    title: "Let the gas out",
    mechanism:
      "Bubbles float droplets back into the band; letting carbon dioxide escape in an open flask, or gentle vacuum without heat, removes them.",
    fits: {
      causes: { "entrained-gas": 0.85 },
      conditions: ["foam or rising bubbles", "bicarbonate or carbonate washes of acidic mixtures"],
    },
    steps: () => [
      "Drain into a round-bottomed or conical flask no more than half full and stir gently in the open until bubbling stops.",
      "For fine foam, apply gentle vacuum on a rotary evaporator with slow rotation and no heat; try a sample first.",
      "Pour back by gravity; do not filter under vacuum afterwards, which draws gas in again.",
    ],
    minutes: { min: 5, max: 20 },
    risks: ["volatile solvent lost under vacuum", "foaming over into the trap"],
    scale: "any",
    evidence: "anecdotal",
    sources: ["common-practice"],
    cautions: ["Check glassware for cracks before vacuum; " + SDS],
    tier: 3,
  },
  {
    id: "drain-band",
    title: "Drain the band and treat it apart",
    mechanism: "Takes the clear layers away from the band so the small emulsified part can be filtered, salted or spun on its own.",
    fits: {
      causes: {
        "surfactant-soap": 0.3,
        "fine-solids": 0.3,
        "chlorinated-base": 0.3,
        "close-densities": 0.25,
        "viscous-crude": 0.25,
        "miscible-cosolvent": 0.1,
      },
      conditions: ["a thin band between clear layers", "when time matters more than the last few % of product"],
    },
    steps: (a) => [
      `Drain the clear ${lowerLayer(a)} up to the band.`,
      "Drain the band into its own flask; leave the clear upper layer in the funnel.",
      "Treat the band alone (filter, salt or centrifuge it) and recombine the organic parts.",
    ],
    minutes: { min: 5, max: 20 },
    risks: ["product held in the band lowers recovery and purity"],
    scale: "any",
    evidence: "common-practice",
    sources: ["common-practice"],
    cautions: [],
    tier: 4,
  },
  {
    id: "swap-solvent",
    title: "Change the extraction solvent",
    mechanism:
      "A solvent with a wider density gap, higher interfacial tension and less water uptake (toluene, MTBE, CPME, heptane–ethyl acetate) splits more cleanly.",
    fits: {
      causes: {
        "close-densities": 0.5,
        "chlorinated-base": 0.4,
        "miscible-cosolvent": 0.3,
        "surfactant-soap": 0.2,
        "viscous-crude": 0.2,
      },
      conditions: ["when nothing else works, or for the next run", "the product must dissolve in the new solvent"],
    },
    steps: (a) => [
      `Evaporate the ${a.mainSolventName} from the organic layer and band, if the product allows.`,
      "Take the residue up in a solvent with a wider density gap and less water uptake.",
      "Repeat the wash with gentle inversions.",
    ],
    minutes: { min: 30, max: 90 },
    risks: ["time", "volatile products lost on evaporation", "solubility of the product in the new solvent"],
    scale: "any",
    evidence: "literature",
    sources: ["anderson-process-from-memory"],
    cautions: ["Evaporate in the hood with a bath suited to the solvent; test ethers for peroxides; " + SDS],
    tier: 5,
  },
];

export function remedyById(id: RemedyId): Remedy {
  const remedy = REMEDIES.find((r) => r.id === id);
  if (!remedy) throw new Error(`No remedy ${id}`);
  return remedy;
}
