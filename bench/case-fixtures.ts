import type { CreateCaseBody } from "../knowledge/contracts/cases";

/*
 * Generated case-log entries for benchmarks and soak tests: a fictional group's work-ups, made
 * from a seeded generator so every run builds the same data. Invented for load only.
 */

/** mulberry32: a small seeded generator, so fixtures are the same in every run. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const ORGANIC = ["dichloromethane", "ethyl acetate", "toluene", "diethyl ether", "MTBE", "chloroform", "heptane", "2-MeTHF", "DCM", "EtOAc"];
const AQUEOUS: CreateCaseBody["system"]["aqueous"][] = [
  { solute: "brine", concentration: "saturated", volumeMl: 50 },
  { solute: "sat. sodium bicarbonate", concentration: "saturated", volumeMl: 40 },
  { solute: "HCl", concentration: { value: 1, unit: "mol/L" }, volumeMl: 30 },
  { solute: "NaOH", concentration: { value: 2, unit: "mol/L" }, volumeMl: 25 },
  { solute: "water", volumeMl: 60 },
  { solute: "ammonium chloride", concentration: "saturated", volumeMl: 40 },
];
const KINDS = ["milky-band", "rag-with-solids", "foam", "whole-volume-cloudy", "three-layers", "hazy-organic"] as const;
const CAUSES = ["surfactant-soap", "fine-solids", "close-densities", "viscous-crude", "miscible-cosolvent", "chlorinated-base", "entrained-gas"];
const REMEDIES = ["let-stand", "swirl-interface", "saturated-brine", "solid-salt", "more-organic", "filter-pad", "centrifuge", "adjust-ph", "drain-band"];
const OUTCOMES = ["cleared", "partly", "no-change", "worse"] as const;
const TAGS = ["amide-coupling", "hydride-reduction", "grignard-quench", "ester-hydrolysis", "cross-coupling", "metal-salts", "scale-up"];
const WORDS = (
  "interface band cloudy haze fines solids rag layer funnel shake vent swirl settle drain filter pad salt brine " +
  "bicarbonate quench amine acid base carboxylate soap surfactant crude viscous dark amber yellow colourless " +
  "stopcock stem flask beaker rotary evaporator dried sulfate magnesium sodium emulsion persisted cleared slowly " +
  "overnight minutes warm cold bath centrifuge tube vial batch scale product recovered yield purity wash extract"
).split(" ");

const pick = <T>(rnd: () => number, xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;

/** The i-th generated case: a valid POST /api/cases body with ~60 words of notes. */
export function generatedCase(i: number, seed = 7): CreateCaseBody {
  const rnd = seededRandom(seed * 1_000_003 + i);
  const kind = pick(rnd, KINDS);
  const tag = pick(rnd, TAGS);
  const organic = pick(rnd, ORGANIC);
  const aqueous = pick(rnd, AQUEOUS);
  const notes = Array.from({ length: 50 + Math.floor(rnd() * 30) }, () => pick(rnd, WORDS)).join(" ");
  const attempts = Array.from({ length: Math.floor(rnd() * 3) }, () => ({
    remedyId: pick(rnd, REMEDIES),
    minutes: Math.floor(rnd() * 30),
    outcome: pick(rnd, OUTCOMES),
  }));
  const day = new Date(Date.UTC(2024, 0, 1) + Math.floor(rnd() * 700) * 86_400_000);
  return {
    title: `${kind.replace(/-/g, " ")} after ${aqueous.solute} wash, ${tag.replace(/-/g, " ")} batch ${i}`,
    system: { organic: [{ solvent: organic, volumeMl: 20 + Math.floor(rnd() * 200) }], aqueous, temperatureC: 20 },
    tags: [tag],
    causes: [pick(rnd, CAUSES)],
    seen: { kind, solids: kind === "rag-with-solids", shaking: "normal" },
    notes,
    status: attempts.some((a) => a.outcome === "cleared") ? "resolved" : "open",
    occurredAt: day.toISOString(),
    attempts,
  };
}

/** Search boxes a chemist would type, from one word to a solvent synonym with a typo. */
export const SEARCH_QUERIES = [
  "brine",
  "milky band",
  "DCM",
  "methylene chloride bicarbonate",
  "centrifge",
  "rag solids filter",
  "grignard",
  "emul",
  "batch 4242",
  "nothing-matches-this-zebra",
];
