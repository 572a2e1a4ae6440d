import type { Sourced } from "../types";

/**
 * pKa values in water at about 25 °C for species met in work-ups and for frequent
 * functional groups. For a base the value is the pKa of its conjugate acid (pKaH).
 * Group entries ("typical") carry the range the family spans; pick the compound entry
 * when there is one.
 */
export type IonisableKind = "acid" | "base";

export interface PkaEntry {
  key: string;
  name: string;
  synonyms: string[];
  kind: IonisableKind;
  /** functional group, used to group the picker */
  group: string;
  pKa: Sourced<number>;
  /** spread of the family for a "typical" group entry, or of the published values */
  range?: [number, number];
}

const E1 = "libretexts-e1-acid-constants";
const E5 = "libretexts-e5-martell-smith";
const REUSCH = "reusch-basicity-table";
const CRC_INORG = "crc-inorganic-dissociation";
const MEM = "from-memory";

type Row = [
  key: string,
  name: string,
  synonyms: string[],
  kind: IonisableKind,
  group: string,
  pKa: number,
  source: string,
  extra?: { range?: [number, number]; note?: string },
];

const ROWS: Row[] = [
  // acids
  ["methanesulfonic-acid", "methanesulfonic acid", ["MsOH"], "acid", "sulfonic acid", -1.9, MEM],
  ["p-toluenesulfonic-acid", "p-toluenesulfonic acid", ["TsOH", "PTSA", "tosic acid"], "acid", "sulfonic acid", -2.8, MEM],
  ["trifluoroacetic-acid", "trifluoroacetic acid", ["TFA"], "acid", "carboxylic acid", 0.5, MEM, { range: [0.2, 0.5] }],
  ["dichloroacetic-acid", "dichloroacetic acid", [], "acid", "carboxylic acid", 1.35, E1],
  ["chloroacetic-acid", "chloroacetic acid", [], "acid", "carboxylic acid", 2.87, E1],
  ["formic-acid", "formic acid", [], "acid", "carboxylic acid", 3.75, E1],
  ["benzoic-acid", "benzoic acid", [], "acid", "carboxylic acid", 4.204, E1],
  ["acetic-acid", "acetic acid", ["AcOH"], "acid", "carboxylic acid", 4.756, E1],
  [
    "aliphatic-carboxylic-acid",
    "aliphatic carboxylic acid (typical)",
    ["alkanoic acid", "fatty acid"],
    "acid",
    "carboxylic acid",
    4.8,
    MEM,
    { range: [4.5, 5.0] },
  ],
  ["aryl-carboxylic-acid", "aryl carboxylic acid (typical)", ["benzoic acids"], "acid", "carboxylic acid", 4.2, MEM, { range: [3.4, 4.5] }],
  ["tetrazole", "5-substituted 1H-tetrazole (typical)", ["tetrazole"], "acid", "tetrazole", 4.9, MEM, { range: [4.5, 5.0] }],
  ["n-acyl-sulfonamide", "N-acyl sulfonamide (typical)", ["acylsulfonamide"], "acid", "sulfonamide", 4.5, MEM, { range: [3.5, 5.5] }],
  ["saccharin", "saccharin", [], "acid", "sulfonimide", 1.6, MEM],
  ["hobt", "1-hydroxybenzotriazole", ["HOBt"], "acid", "N-hydroxy heterocycle", 4.6, MEM],
  ["n-hydroxysuccinimide", "N-hydroxysuccinimide", ["NHS", "HOSu"], "acid", "N-hydroxy imide", 6.0, MEM],
  ["meldrums-acid", "Meldrum's acid", [], "acid", "1,3-dicarbonyl", 4.97, MEM],
  ["acetylacetone", "acetylacetone", ["pentane-2,4-dione", "acac"], "acid", "1,3-dicarbonyl", 8.99, MEM],
  ["picric-acid", "picric acid (2,4,6-trinitrophenol)", ["2,4,6-trinitrophenol"], "acid", "electron-poor phenol", 0.4, MEM],
  ["2-4-dinitrophenol", "2,4-dinitrophenol", [], "acid", "electron-poor phenol", 4.1, MEM],
  ["pentafluorophenol", "pentafluorophenol", [], "acid", "electron-poor phenol", 5.5, MEM],
  ["4-nitrophenol", "4-nitrophenol", ["p-nitrophenol"], "acid", "electron-poor phenol", 7.15, MEM],
  ["4-chlorophenol", "4-chlorophenol", [], "acid", "phenol", 9.4, MEM],
  ["2-naphthol", "2-naphthol", ["β-naphthol"], "acid", "phenol", 9.5, MEM],
  ["phenol", "phenol", [], "acid", "phenol", 9.99, E1],
  ["4-methoxyphenol", "4-methoxyphenol", ["p-methoxyphenol"], "acid", "phenol", 10.2, MEM],
  ["thiophenol", "thiophenol (benzenethiol)", ["benzenethiol", "PhSH"], "acid", "thiol", 6.6, MEM],
  ["alkanethiol", "alkanethiol (typical)", ["alkyl thiol", "mercaptan"], "acid", "thiol", 10.5, MEM, { range: [10.0, 11.0] }],
  ["phthalimide", "phthalimide", [], "acid", "imide", 8.3, MEM],
  ["succinimide", "succinimide", [], "acid", "imide", 9.6, MEM],
  ["n-aryl-sulfonamide", "N-aryl sulfonamide (typical)", ["sulfonanilide"], "acid", "sulfonamide", 8.5, MEM, { range: [8.0, 9.0] }],
  ["benzenesulfonamide", "benzenesulfonamide (primary sulfonamide)", ["primary sulfonamide"], "acid", "sulfonamide", 10.1, MEM],
  ["hydroxamic-acid", "hydroxamic acid (typical)", [], "acid", "hydroxamic acid", 8.8, MEM, { range: [8.5, 9.5] }],
  ["phenylboronic-acid", "phenylboronic acid", ["boronic acid"], "acid", "boronic acid", 8.8, MEM],
  // bases (pKa of the conjugate acid)
  ["amide", "carboxamide (typical)", ["amide"], "base", "amide", -0.5, REUSCH, { note: "not taken up by dilute acid" }],
  ["2-nitroaniline", "2-nitroaniline", ["o-nitroaniline"], "base", "aniline", -0.3, MEM],
  ["diphenylamine", "diphenylamine", [], "base", "aniline", 0.8, REUSCH],
  ["4-nitroaniline", "4-nitroaniline", ["p-nitroaniline"], "base", "aniline", 1.0, REUSCH],
  ["3-nitroaniline", "3-nitroaniline", ["m-nitroaniline"], "base", "aniline", 2.5, MEM],
  ["4-chloroaniline", "4-chloroaniline", ["p-chloroaniline"], "base", "aniline", 4.0, MEM],
  ["aniline", "aniline", ["aminobenzene", "PhNH2"], "base", "aniline", 4.601, E5],
  ["n-n-dimethylaniline", "N,N-dimethylaniline", ["DMA (aniline)"], "base", "aniline", 5.1, REUSCH],
  ["quinoline", "quinoline", [], "base", "pyridine", 4.9, MEM],
  ["pyridine", "pyridine", ["py"], "base", "pyridine", 5.2, REUSCH],
  ["2-6-lutidine", "2,6-lutidine (2,6-dimethylpyridine)", ["2,6-dimethylpyridine"], "base", "pyridine", 6.7, REUSCH],
  ["2-4-6-collidine", "2,4,6-collidine", ["2,4,6-trimethylpyridine"], "base", "pyridine", 7.4, MEM],
  ["dmap", "4-(dimethylamino)pyridine", ["DMAP"], "base", "pyridine", 9.7, REUSCH],
  ["imidazole", "imidazole", [], "base", "imidazole", 7.0, REUSCH],
  ["n-methylimidazole", "N-methylimidazole", ["NMI", "1-methylimidazole"], "base", "imidazole", 7.0, MEM],
  ["n-methylmorpholine", "N-methylmorpholine", ["NMM"], "base", "tertiary amine", 7.4, MEM],
  ["morpholine", "morpholine", [], "base", "secondary amine", 8.3, REUSCH, { range: [8.3, 8.5] }],
  ["dabco", "1,4-diazabicyclo[2.2.2]octane (first protonation)", ["DABCO"], "base", "tertiary amine", 8.7, REUSCH],
  ["ammonia", "ammonia", ["NH3"], "base", "ammonia", 9.25, CRC_INORG],
  ["benzylamine", "benzylamine", [], "base", "primary amine", 9.34, MEM],
  ["n-methylpiperidine", "N-methylpiperidine", [], "base", "tertiary amine", 10.1, MEM],
  ["primary-alkylamine", "primary alkylamine (typical)", ["n-butylamine", "RNH2"], "base", "primary amine", 10.6, MEM, { range: [10.0, 10.8] }],
  ["tertiary-alkylamine", "tertiary alkylamine (typical)", ["R3N"], "base", "tertiary amine", 10.0, MEM, { range: [9.5, 11.0] }],
  ["triethylamine", "triethylamine", ["Et3N", "TEA"], "base", "tertiary amine", 10.75, MEM],
  ["dipea", "N,N-diisopropylethylamine", ["DIPEA", "Hünig's base", "DIEA"], "base", "tertiary amine", 11.0, MEM, {
    range: [10.5, 11.4],
    note: "published aqueous values scatter",
  }],
  ["diethylamine", "diethylamine", ["Et2NH"], "base", "secondary amine", 11.0, MEM],
  ["secondary-alkylamine", "secondary alkylamine (typical)", ["R2NH"], "base", "secondary amine", 11.0, MEM, { range: [10.5, 11.3] }],
  ["piperidine", "piperidine", [], "base", "secondary amine", 11.1, MEM],
  ["pyrrolidine", "pyrrolidine", [], "base", "secondary amine", 11.3, MEM],
  ["dbu", "1,8-diazabicyclo[5.4.0]undec-7-ene", ["DBU"], "base", "amidine", 12.0, MEM, {
    range: [11.5, 13.5],
    note: "aqueous value uncertain; treat as fully protonated below pH 9",
  }],
  ["tetramethylguanidine", "1,1,3,3-tetramethylguanidine", ["TMG"], "base", "guanidine", 13.6, MEM],
];

export const PKA_TABLE: PkaEntry[] = ROWS.map(([key, name, synonyms, kind, group, pKa, source, extra]) => ({
  key,
  name,
  synonyms,
  kind,
  group,
  pKa: extra?.note ? { value: pKa, source, note: extra.note } : { value: pKa, source },
  ...(extra?.range ? { range: extra.range } : {}),
}));

const norm = (s: string) => s.toLowerCase().replace(/[\s,()\-–]+/g, "");

/** Exact match on key, name or synonym (case, spaces and dashes ignored). */
export function findPka(query: string): PkaEntry | undefined {
  const q = norm(query);
  return PKA_TABLE.find((e) => norm(e.key) === q || norm(e.name) === q || e.synonyms.some((s) => norm(s) === q));
}

/** Entries whose name, synonym or group contains the query, for the picker. */
export function searchPka(query: string, kind?: IonisableKind): PkaEntry[] {
  const q = norm(query);
  return PKA_TABLE.filter(
    (e) =>
      (!kind || e.kind === kind) &&
      (q === "" || norm(e.name).includes(q) || norm(e.group).includes(q) || e.synonyms.some((s) => norm(s).includes(q))),
  );
}
