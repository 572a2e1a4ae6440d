/**
 * Sources behind the curated values. A key ending in "-from-memory" means the value was
 * recalled from that publication while writing the table, not re-read from it: check it
 * against the printed source before relying on the third decimal.
 */
export type SourceKind =
  | "handbook"
  | "paper"
  | "dataset"
  | "guide"
  | "regulation"
  | "common-practice"
  | "from-memory";

export interface SourceEntry {
  title: string;
  kind: SourceKind;
}

export const SOURCES: Record<string, SourceEntry> = {
  "common-practice": {
    title: "Common laboratory practice (rule of thumb without a published source)",
    kind: "common-practice",
  },
  "from-memory": {
    title: "Recalled from memory without a source at hand; verify before relying on it",
    kind: "from-memory",
  },
  "computed-from-formula": {
    title:
      "Computed from the molecular formula with IUPAC standard atomic weights (abridged: H 1.008, C 12.011, N 14.007, O 15.999, Na 22.990, S 32.06, Cl 35.45, K 39.098, Ca 40.078, Li 6.94)",
    kind: "dataset",
  },
  "crc-organic-from-memory": {
    title:
      "CRC Handbook of Chemistry and Physics (97th ed., 2016), 'Physical constants of organic compounds' — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "riddick-from-memory": {
    title:
      "Riddick, Bunger & Sakano, Organic Solvents: Physical Properties and Methods of Purification, 4th ed. (Wiley, 1986), densities at 20 and 25 °C — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "smallwood-from-memory": {
    title: "Smallwood, Handbook of Organic Solvent Properties (Arnold, 1996) — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "stephenson-1992-from-memory": {
    title:
      "Stephenson, R. M. 'Mutual solubilities: water–ketones, water–ethers and water–gasoline–alcohols' and companion papers, J. Chem. Eng. Data 1992, 37, 80–95 — values recalled from memory, not re-read",
    kind: "from-memory",
  },
  "yalkowsky-from-memory": {
    title:
      "Yalkowsky, He & Jain, Handbook of Aqueous Solubility Data, 2nd ed. (CRC Press, 2010), hydrocarbons and chlorinated solvents in water — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "supplier-ether-from-memory": {
    title:
      "Published producer data sheets and process papers for CPME and 2-MeTHF (Watanabe et al., Org. Process Res. Dev. 2007, 11, 251; Aycock, Org. Process Res. Dev. 2007, 11, 156) — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "sds-flash-point-from-memory": {
    title:
      "Closed-cup flash points as printed on typical supplier safety data sheets (vary by 2–5 °C between SDSs; use the lab's own SDS) — recalled from memory",
    kind: "from-memory",
  },
  "kelly-1996-from-memory": {
    title:
      "Kelly, R. J. 'Review of safety guidelines for peroxidizable organic chemicals', Chem. Health Saf. 1996, 3(5), 28–36, classes A–D as reproduced in Prudent Practices in the Laboratory (NRC, 2011) — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "chem21-2016-from-memory": {
    title:
      "Prat, D. et al. 'CHEM21 selection guide of classical- and less classical-solvents', Green Chem. 2016, 18, 288–296, final ranking after panel discussion — recalled from memory; check against the paper's tables",
    kind: "from-memory",
  },
  "lange-antoine-from-memory": {
    title:
      "Dean (ed.), Lange's Handbook of Chemistry, 15th ed. (McGraw-Hill, 1999), 'Vapor pressures of organic compounds' Antoine constants, log10(P/mmHg) = A − B/(C + t/°C) — recalled from memory; each set is checked in the tests to reproduce the normal boiling point",
    kind: "from-memory",
  },
  "kell-1975-from-memory": {
    title:
      "Kell, G. S. 'Density, thermal expansivity, and compressibility of liquid water from 0° to 150 °C', J. Chem. Eng. Data 1975, 20, 97–105, density equation — coefficients recalled from memory and checked in the tests against Perry's DIPPR water correlation (read)",
    kind: "from-memory",
  },
  "crc-aqueous-2021": {
    title:
      "CRC Handbook of Chemistry and Physics, 102nd ed. (2021), 'Concentrative properties of aqueous solutions: density, refractive index, freezing point depression, and viscosity', density at 20 °C vs mass % — read from a public tab-separated transcription of the table",
    kind: "handbook",
  },
  "crc-aqueous-2021-perry-from-memory": {
    title:
      "CRC Handbook of Chemistry and Physics, 102nd ed. (2021), concentrative-properties table (read, to 40 %), extended to 50 % with densities recalled from memory from Perry's Chemical Engineers' Handbook, 8th ed., Section 2, sodium hydroxide solutions",
    kind: "handbook",
  },
  "perry-dippr-2008": {
    title:
      "Perry's Chemical Engineers' Handbook, 8th ed. (2008), Table 2-32, DIPPR-105 liquid-density correlations ρ = C1/C2^(1+(1−T/C3)^C4) mol/dm³ — coefficients read from a public transcription in an open-source property library",
    kind: "handbook",
  },
  "crc-solubility-from-memory": {
    title:
      "CRC Handbook of Chemistry and Physics, 'Aqueous solubility of inorganic compounds at various temperatures' (mass % of anhydrous solute in the saturated solution) — recalled from memory, not re-read",
    kind: "from-memory",
  },
  "layer-thresholds": {
    title:
      "Confidence thresholds for the layer check: common practice ('warn when the densities differ by less than about 0.05 g/mL') refined by an uncertainty budget stated in knowledge/layers.ts",
    kind: "common-practice",
  },
  "ideal-mixing": {
    title: "Ideal volume-additive mixing of the organic solvents (assumption; real mixtures deviate by about 1–2 % in density)",
    kind: "common-practice",
  },
};

export function isSourceKey(key: string): boolean {
  return Object.prototype.hasOwnProperty.call(SOURCES, key);
}
