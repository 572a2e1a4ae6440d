import { planSourceEntry } from "../plan/sources";
import type { SourceEntry } from "../sources";

/**
 * Sources behind the emulsion catalogue. "Read" entries were read (in part) while writing;
 * a key ending in "-from-memory" names a publication recalled without the text at hand.
 */
export interface EmulsionSourceEntry extends SourceEntry {
  key: string;
}

export const EMULSION_SOURCES: EmulsionSourceEntry[] = [
  {
    key: "epa-1664-white-paper",
    title:
      "US EPA Method 1664 (n-hexane extractable material), as quoted in an instrument maker's white paper on emulsion-breaking techniques for oil-in-water solvent extractions: an emulsion larger than one-third of the solvent layer must be broken before the phase split is finished (read in part)",
    kind: "regulation",
  },
  {
    key: "epa-3510c-from-memory",
    title:
      "US EPA SW-846 Method 3510C, Separatory funnel liquid–liquid extraction (rev. 3, 1996): an emulsion over one-third of the solvent layer calls for mechanical techniques such as stirring, filtration through glass wool or centrifugation — emulsion wording recalled from memory",
    kind: "from-memory",
  },
  {
    key: "nichols-techniques-from-memory",
    title:
      "Nichols, L. Organic Chemistry Laboratory Techniques (open textbook, LibreTexts), chapter 4 (extraction, acid–base extraction) and §7.19 (drying agents) — recalled from memory, not re-read",
    kind: "from-memory",
  },
  {
    key: "vogel-5th-from-memory",
    title:
      "Furniss, B. S. et al. Vogel's Textbook of Practical Organic Chemistry, 5th ed. (Longman, 1989), extraction section: standing, swirling, salting out, a little alcohol, filtration and centrifuging against emulsions — recalled from memory",
    kind: "from-memory",
  },
  {
    key: "anderson-process-from-memory",
    title:
      "Anderson, N. G. Practical Process Research and Development, 2nd ed. (Academic Press, 2012), work-up chapter: co-solvents, salting out, running more concentrated, aliquot trials and solvent replacement against emulsions — recalled from memory",
    kind: "from-memory",
  },
  {
    key: "fieser-lah-from-memory",
    title:
      "Fieser, L. F.; Fieser, M. Reagents for Organic Synthesis, Vol. 1 (Wiley, 1967), lithium aluminium hydride entry: 1 mL water, 1 mL 15 % NaOH, 3 mL water per g of hydride — recalled from memory",
    kind: "from-memory",
  },
  {
    key: "lah-quench-teaching-page",
    title:
      "An open chemistry-library teaching page on quenching lithium aluminium hydride: the 1 : 1 : 3 water / 15 % NaOH / water sequence then filtration through diatomaceous earth, or aqueous sodium potassium tartrate (read)",
    kind: "guide",
  },
  {
    key: "emulsion-teaching-module",
    title:
      "A university general-chemistry laboratory module on separatory-funnel emulsions: wait, swirl slowly first, then a little saturated NaCl; think about reagents that react with the salt (read)",
    kind: "guide",
  },
  {
    key: "extraction-teaching-page",
    title:
      "A university organic-laboratory page on extraction: solid NaCl well below its solubility, a few millilitres of alcohol, gravity filtration through glass wool (read)",
    kind: "guide",
  },

  {
    key: "stokes-settling",
    title:
      "Stokes' law for a sphere settling in a viscous fluid, v = 2·Δρ·g·r²/(9·η) (any transport-phenomena or physical-chemistry text)",
    kind: "handbook",
  },
  {
    key: "henderson-hasselbalch",
    title:
      "Distribution of an ionisable compound: D = P·f(neutral), f from the Henderson–Hasselbalch relation (any physical-organic or pharmaceutics text)",
    kind: "handbook",
  },


  {
    key: "sodium-sulfate-hydrate-from-memory",
    title:
      "Sodium sulfate decahydrate loses its water of crystallisation at 32.4 °C, so the anhydrous salt stops drying above about 32 °C (CRC Handbook, inorganic compounds) — recalled from memory",
    kind: "from-memory",
  },
  {
    key: "tube-resistance-from-memory",
    title:
      "Plastic-ware chemical-resistance charts: polycarbonate is attacked by chlorinated solvents and ketones; polypropylene and fluoropolymers resist most solvents — recalled from memory",
    kind: "from-memory",
  },
];

const emulsionKeys = new Set(EMULSION_SOURCES.map((s) => s.key));

/** The entry for a key from this list, the plan list or the shared list. */
export function emulsionSource(key: string): SourceEntry | undefined {
  return emulsionKeys.has(key) ? EMULSION_SOURCES.find((s) => s.key === key) : planSourceEntry(key);
}

export function isEmulsionSourceKey(key: string): boolean {
  return emulsionSource(key) !== undefined;
}
