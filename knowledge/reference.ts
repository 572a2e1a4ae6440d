import Fuse from "fuse.js";
import { AQUEOUS_SOLUTES } from "./aqueous";
import { densityAtMassFractionGPerMl, toMassFractionPct } from "./concentration";
import { SOLVENTS } from "./solvents";
import type { AqueousSolute, Concentration, ReferenceData, Solvent } from "./types";
import { KnowledgeInputError } from "./types";

export const SHIPPED_REFERENCE: ReferenceData = { solvents: SOLVENTS, solutes: AQUEOUS_SOLUTES };

/** Lower case, without spaces or punctuation: "1,2-DCE" → "12dce", "75-09-2" → "75092". */
export function normaliseName(text: string): string {
  let normal = normalCache.get(text);
  if (normal === undefined) {
    normal = text
      .normalize("NFKD")
      .replace(/[\u0300-\u036f]/g, "")
      .toLowerCase()
      .replace(/[^a-z0-9]/g, "");
    // The same few hundred names are looked up on every request: remember them, within bounds.
    if (normalCache.size >= NORMAL_CACHE_MAX) normalCache.clear();
    normalCache.set(text, normal);
  }
  return normal;
}

const NORMAL_CACHE_MAX = 4096;
const normalCache = new Map<string, string>();

interface Named {
  key: string;
  name: string;
  synonyms: string[];
  cas: string;
  formula: string;
}

interface Index<T extends Named> {
  exact: Map<string, T>;
  formula: Map<string, T[]>;
  fuse: Fuse<{ item: T; names: string[]; normal: string[] }>;
}

/**
 * Typing errors accepted for a confident match, by length of the normalised query: short
 * abbreviations must match exactly ("EA", "DCM"), longer names may carry one or two slips.
 */
export function allowedTypos(normalisedLength: number): number {
  if (normalisedLength <= 4) return 0;
  if (normalisedLength <= 7) return 1;
  return 2;
}

/** Optimal-string-alignment edit distance (insert, delete, substitute, swap neighbours). */
export function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) => [i, ...new Array<number>(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j++) d[0]![j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, d[i - 2]![j - 2]! + 1);
      d[i]![j] = v;
    }
  }
  return d[a.length]![b.length]!;
}

/** "NaHSO3", "KHSO4", "CH2Cl2": formulae are matched exactly, never corrected (NaHSO3 is not NaHCO3). */
export function looksLikeFormula(raw: string): boolean {
  return /^(?:[A-Z][a-z]?\d*|\((?:[A-Z][a-z]?\d*)+\)\d*)+$/.test(raw) && (raw.match(/[A-Z]/g) ?? []).length >= 2;
}

const ALKYL_STEMS = ["meth", "eth", "prop", "but", "pent", "hex", "hept", "oct", "non", "dec"];
const MULTIPLIERS = ["tetra", "tri", "di", "iso", "cyclo", "tert", "sec"];
const ENDINGS = ["anol", "ol", "ane", "ene", "yne", "ate", "ite", "ide", "one", "al", "ine", "ile"];

function stemOf(token: string): string | undefined {
  let t = token;
  for (const m of MULTIPLIERS) if (t.startsWith(m) && t.length > m.length + 2) t = t.slice(m.length);
  return ALKYL_STEMS.find((s) => t.startsWith(s));
}

function endingOf(token: string): string | undefined {
  const singular = token.length > 5 && token.endsWith("s") ? token.slice(0, -1) : token;
  const e = ENDINGS.find((x) => singular.endsWith(x));
  return e === "anol" ? "ol" : e;
}

const digitsOf = (text: string) => (text.match(/\d/g) ?? []).join("");
const tokensOf = (text: string) => normaliseTokens(text);

function normaliseTokens(text: string): string[] {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter(Boolean);
}

/**
 * A typing slip may be corrected; a different compound may not. Refuses a fuzzy match that would
 * change a locant or other digit (1- vs 2-butanol), an alkyl stem (methyl vs ethyl acetate), a
 * functional ending (pentanol vs pentane, chlorite vs chloride), a one-letter prefix (p- vs o-xylene),
 * or a word by more than that word's own typo allowance (hydride vs hydroxide).
 */
export function sameCompoundShape(query: string, candidate: string): boolean {
  if (digitsOf(query) !== digitsOf(candidate)) return false;
  const a = tokensOf(query);
  const b = tokensOf(candidate);
  const letters = (t: string[]) => t.filter((x) => x.length === 1).sort().join();
  if (letters(a) !== letters(b)) return false;
  const pairs: [string, string][] =
    a.length === b.length ? a.map((t, i) => [t, b[i]!]) : [[a.join(""), b.join("")]];
  for (const [x, y] of pairs) {
    if (x === y) continue;
    if (x.length <= 1 || y.length <= 1) return false;
    const sx = stemOf(x);
    const sy = stemOf(y);
    if (sx && sy && sx !== sy) return false;
    const ex = endingOf(x);
    const ey = endingOf(y);
    if (ex && ey && ex !== ey) return false;
    if (a.length === b.length && editDistance(x, y) > allowedTypos(x.length)) return false;
  }
  return true;
}

function buildIndex<T extends Named>(items: T[]): Index<T> {
  const exact = new Map<string, T>();
  const formula = new Map<string, T[]>();
  for (const item of items) {
    for (const n of [item.key, item.name, item.cas, ...item.synonyms]) {
      const k = normaliseName(n);
      // First entry wins so a synonym cannot steal another entry's own name.
      if (k !== "" && !exact.has(k)) exact.set(k, item);
    }
    const f = normaliseName(item.formula);
    formula.set(f, [...(formula.get(f) ?? []), item]);
  }
  // Own key and name outrank someone else's synonym.
  for (const item of items) {
    exact.set(normaliseName(item.key), item);
    exact.set(normaliseName(item.name), item);
  }
  const docs = items.map((item) => {
    const names = [item.name, item.key, ...item.synonyms, item.cas, item.formula];
    return { item, names, normal: names.map(normaliseName) };
  });
  const fuse = new Fuse(docs, {
    keys: [
      { name: "names", weight: 1 },
      { name: "normal", weight: 0.7 },
    ],
    includeScore: true,
    ignoreLocation: true,
    threshold: 0.4,
  });
  return { exact, formula, fuse };
}

const solventIndexes = new WeakMap<ReferenceData, Index<Solvent>>();
const soluteIndexes = new WeakMap<ReferenceData, Index<AqueousSolute>>();

function cached<T extends Named>(cache: WeakMap<ReferenceData, Index<T>>, ref: ReferenceData, items: T[]): Index<T> {
  let idx = cache.get(ref);
  if (!idx) {
    idx = buildIndex(items);
    cache.set(ref, idx);
  }
  return idx;
}

const solventIndex = (ref: ReferenceData) => cached(solventIndexes, ref, ref.solvents);
const soluteIndex = (ref: ReferenceData) => cached(soluteIndexes, ref, ref.solutes);

function find<T extends Named>(idx: Index<T>, query: string): T | undefined {
  const q = normaliseName(String(query ?? ""));
  if (q === "") return undefined;
  const hit = idx.exact.get(q);
  if (hit) return hit;
  const byFormula = idx.formula.get(q);
  if (byFormula && byFormula.length === 1) return byFormula[0];
  // Fuzzy: fuse.js proposes candidates; one is taken only if it is within the typo allowance
  // and strictly closer than every other entry (DCM vs DCE must never be a coin toss).
  const allowed = allowedTypos(q.length);
  if (allowed === 0) return undefined;
  if (looksLikeFormula(String(query).trim())) return undefined;
  const scored = idx.fuse
    .search(String(query).trim(), { limit: 8 })
    .map((r) => {
      const distances = r.item.names
        .map((name, i) => ({ name, d: editDistance(q, r.item.normal[i]!) }))
        .filter((x) => sameCompoundShape(String(query), x.name));
      return { item: r.item.item, distance: distances.length ? Math.min(...distances.map((x) => x.d)) : Infinity };
    })
    .sort((a, b) => a.distance - b.distance);
  const best = scored[0];
  if (!best || best.distance > allowed) return undefined;
  if (scored.some((c) => c.item !== best.item && c.distance === best.distance)) return undefined;
  return best.item;
}

function suggest<T extends Named>(idx: Index<T>, query: string, limit: number): T[] {
  const q = String(query ?? "").trim();
  if (q === "") return [];
  const out: T[] = [];
  const exact = find(idx, q);
  if (exact) out.push(exact);
  for (const r of idx.fuse.search(q, { limit: limit + 1 })) {
    if (!out.includes(r.item.item)) out.push(r.item.item);
  }
  return out.slice(0, limit);
}

/** Exact match on key, name, synonym, CAS or (unambiguous) formula, ignoring case, spaces and punctuation; else a confident fuzzy match. */
export function findSolvent(query: string, ref: ReferenceData = SHIPPED_REFERENCE): Solvent | undefined {
  return find(solventIndex(ref), query);
}

export function suggestSolvents(query: string, ref: ReferenceData = SHIPPED_REFERENCE, limit = 5): Solvent[] {
  return suggest(solventIndex(ref), query, limit);
}

/** "sat. ", "saturated ", "aq. ", "aqueous ": how a wash is named at the bench, not part of the solute's name. */
const WASH_QUALIFIER = /^\s*(?:sat(?:urated)?|aq(?:ueous)?)\b\.?\s*/i;

export function findSolute(query: string, ref: ReferenceData = SHIPPED_REFERENCE): AqueousSolute | undefined {
  const hit = find(soluteIndex(ref), query);
  if (hit || typeof query !== "string") return hit;
  const bare = query.replace(WASH_QUALIFIER, "");
  return bare !== query && bare.trim() !== "" ? findSolute(bare, ref) : undefined;
}

export function suggestSolutes(query: string, ref: ReferenceData = SHIPPED_REFERENCE, limit = 5): AqueousSolute[] {
  return suggest(soluteIndex(ref), query, limit);
}

/** findSolvent, or a KnowledgeInputError naming the field with the closest names. */
export function requireSolvent(query: string, field: string, ref: ReferenceData = SHIPPED_REFERENCE): Solvent {
  const s = typeof query === "string" ? findSolvent(query, ref) : undefined;
  if (s) return s;
  const suggestions = typeof query === "string" ? suggestSolvents(query, ref).map((x) => x.name) : [];
  throw new KnowledgeInputError(field, `Unknown solvent "${String(query)}".`, suggestions);
}

export function requireSolute(query: string, field: string, ref: ReferenceData = SHIPPED_REFERENCE): AqueousSolute {
  const s = typeof query === "string" ? findSolute(query, ref) : undefined;
  if (s) return s;
  const suggestions = typeof query === "string" ? suggestSolutes(query, ref).map((x) => x.name) : [];
  throw new KnowledgeInputError(field, `Unknown aqueous solute "${String(query)}".`, suggestions);
}

// ── temperature ──────────────────────────────────────────────────────────────

/**
 * Temperatures the layer check accepts. 0 °C is where water freezes; above 60 °C a
 * separatory funnel is no longer a bench operation, and the aqueous temperature
 * correction (below) has not been checked beyond it.
 */
export const MIN_TEMPERATURE_C = 0;
export const MAX_TEMPERATURE_C = 60;

/** Pure-water density (g/mL) from Kell's 1975 equation, 0–150 °C. */
export function waterDensityGPerMl(temperatureC: number): number {
  const t = temperatureC;
  const num =
    999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5;
  return num / (1 + 16.87985e-3 * t) / 1000;
}

export function checkTemperature(temperatureC: number, field = "temperatureC"): void {
  if (typeof temperatureC !== "number" || !Number.isFinite(temperatureC)) {
    throw new KnowledgeInputError(field, "The temperature must be a number in °C.");
  }
  if (temperatureC < MIN_TEMPERATURE_C || temperatureC > MAX_TEMPERATURE_C) {
    throw new KnowledgeInputError(
      field,
      `The layer check covers ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C (got ${temperatureC} °C).`,
    );
  }
}

/**
 * Density of a pure solvent at a temperature, linear in T from the 20 °C value (water uses
 * Kell's equation). Refuses temperatures at or below the melting point and at or above the
 * normal boiling point, where the liquid is not what the table describes.
 */
export function solventDensityGPerMl(solvent: Solvent, temperatureC: number, field = "temperatureC"): number {
  if (typeof temperatureC !== "number" || !Number.isFinite(temperatureC)) {
    throw new KnowledgeInputError(field, "The temperature must be a number in °C.");
  }
  if (temperatureC <= solvent.meltingPointC.value) {
    throw new KnowledgeInputError(field, `${solvent.name} freezes at ${solvent.meltingPointC.value} °C; ${temperatureC} °C is too cold.`);
  }
  if (temperatureC >= solvent.boilingPointC.value) {
    throw new KnowledgeInputError(field, `${solvent.name} boils at ${solvent.boilingPointC.value} °C; ${temperatureC} °C is too hot.`);
  }
  if (solvent.key === "water") return waterDensityGPerMl(temperatureC);
  return solvent.densityGPerMl20C.value + solvent.densityTempCoeffGPerMlPerK.value * (temperatureC - 20);
}

/**
 * Density of an aqueous solution at a temperature: the 20 °C table value scaled by
 * ρ_water(T)/ρ_water(20 °C). An approximation: salt solutions expand faster than water, so
 * away from 20 °C strong solutions are off by up to about 0.00035 g/mL per K (saturated brine
 * 10 K from 20 °C: ≈ 0.004 g/mL).
 */
export function aqueousDensityGPerMl(
  solute: AqueousSolute,
  concentration: Concentration | undefined,
  temperatureC: number,
  field = "aqueous.concentration",
): number {
  checkTemperature(temperatureC);
  const w = toMassFractionPct(solute, concentration, field);
  const rho20 = densityAtMassFractionGPerMl(solute, w, field);
  return (rho20 * waterDensityGPerMl(temperatureC)) / waterDensityGPerMl(20);
}
