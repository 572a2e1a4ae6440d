import { SOURCES, type SourceEntry } from "../sources";

/**
 * Sources behind the extraction-plan values. Kept beside the plan code so the layer-check
 * list stays with its owner; `planSourceEntry` looks a key up in both lists.
 * Entries marked "read here" were read in a public copy while writing the table.
 */
export const PLAN_SOURCES: Record<string, SourceEntry> = {
  "crc-inorganic-dissociation": {
    title:
      "CRC Handbook of Chemistry and Physics, 'Dissociation constants of inorganic acids and bases' (from Perrin, Ionization Constants of Inorganic Acids and Bases in Aqueous Solution, 2nd ed., Pergamon 1982), 25 °C, zero ionic strength; Kw = 1.01 × 10⁻¹⁴ — read here in a public copy of the table",
    kind: "handbook",
  },
  "libretexts-e1-acid-constants": {
    title:
      "LibreTexts Chemistry reference tables, 'E1: Acid Dissociation Constants at 25 °C' (CRC-derived values) — read here",
    kind: "handbook",
  },
  "libretexts-e5-martell-smith": {
    title:
      "LibreTexts Chemistry reference tables, 'E5: Acid Dissociation Constants of Organics', from Martell & Smith, Critical Stability Constants, vols 1–4 (Plenum, 1976), 25 °C, zero ionic strength — read here",
    kind: "handbook",
  },
  "reusch-basicity-table": {
    title:
      "Reusch, W., Virtual Textbook of Organic Chemistry (Michigan State University), 'Ionization constants of B–H⁺ onium acids' table (pKa of the conjugate acid, water) — read here",
    kind: "handbook",
  },
  "codata-1989-from-memory": {
    title:
      "Cox, Wagman & Medvedev, CODATA Key Values for Thermodynamics (Hemisphere, 1989): ΔfH°(H2O, l) = −285.830 kJ/mol and ΔfH°(OH⁻, aq) = −230.015 kJ/mol, so H⁺ + OH⁻ → H2O has ΔH° = −55.8 kJ/mol at 25 °C — the two entries recalled from memory, not re-read",
    kind: "from-memory",
  },
  "si-2019-gas-constant": {
    title:
      "SI Brochure, 9th ed. (BIPM, 2019): molar gas constant R = NA·k = 8.314 462 618 J mol⁻¹ K⁻¹ (exact); standard atmosphere 101 325 Pa",
    kind: "dataset",
  },
  "water-heat-capacity-from-memory": {
    title:
      "Specific heat capacity of liquid water ≈ 4.18 J g⁻¹ K⁻¹ at 20–25 °C (4.1813 at 25 °C, IAPWS) — recalled from memory; dilute salt solutions are a few per cent lower",
    kind: "from-memory",
  },
  "nichols-extraction-theory": {
    title:
      "Nichols, L., Organic Chemistry Laboratory Techniques (open textbook, LibreTexts, CC BY-NC-ND), chapter 4 'Extraction': fraction left after n extractions = (V_aq/(V_aq + D·V_org))ⁿ and the one-large-versus-several-small worked comparison",
    kind: "handbook",
  },
  "prudent-practices-2011": {
    title:
      "National Research Council, Prudent Practices in the Laboratory (National Academies Press, 2011), separatory funnels: vent often, cool warm solutions first, and with volatile solvents in funnels over 1 L pressure can force the stopper out — work in smaller batches",
    kind: "guide",
  },
  "alfonsi-2008-from-memory": {
    title:
      "Alfonsi, K. et al. 'Green chemistry tools to influence a medicinal chemistry and research chemistry based organisation', Green Chem. 2008, 10, 31–36 (Pfizer solvent guide and its replacement table) — recalled from memory as reproduced in a university EHS page",
    kind: "from-memory",
  },
  "sander-2015-from-memory": {
    title:
      "Sander, R. 'Compilation of Henry's law constants (version 4.0) for water as solvent', Atmos. Chem. Phys. 2015, 15, 4399–4981: CO2 Hcp ≈ 3.4 × 10⁻⁴ mol m⁻³ Pa⁻¹ (0.034 mol/L at 1 atm) at 25 °C, d ln H / d(1/T) ≈ 2400 K — recalled from memory",
    kind: "from-memory",
  },
  "collander-leo-1971-from-memory": {
    title:
      "Leo, Hansch & Elkins, 'Partition coefficients and their uses', Chem. Rev. 1971, 71, 525–616 (Collander relations log K_solvent = a·log P_octanol + b) — recalled from memory",
    kind: "from-memory",
  },
};

/** Either list's entry for a key; plan code cites keys from both. */
export function planSourceEntry(key: string): SourceEntry | undefined {
  if (Object.prototype.hasOwnProperty.call(PLAN_SOURCES, key)) return PLAN_SOURCES[key];
  if (Object.prototype.hasOwnProperty.call(SOURCES, key)) return SOURCES[key];
  return undefined;
}

/** The plan keys merged over the layer-check keys, for a sources screen or a print view. */
export function allSources(): Record<string, SourceEntry> {
  return { ...SOURCES, ...PLAN_SOURCES };
}
