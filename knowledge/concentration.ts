import { unit as mathUnit, type Unit } from "./units";
import type { AqueousSolute, Concentration, ConcentrationUnit, DensityPoint } from "./types";
import { KnowledgeInputError } from "./types";

/*
 * Concentration conversions for aqueous solutions. Densities between tabulated points come
 * from a monotone cubic Hermite interpolant (Fritsch & Carlson, SIAM J. Numer. Anal. 1980,
 * 17, 238): it passes through every point, never overshoots between them, and keeps the
 * table's direction (ammonia solutions get lighter as they get stronger).
 */

const TOLERANCE = 1e-9;

/** Tangents for a monotone cubic Hermite interpolant through (xs, ys), Fritsch–Carlson limited. */
function monotoneTangents(xs: number[], ys: number[]): number[] {
  const n = xs.length;
  const secants: number[] = [];
  for (let k = 0; k < n - 1; k++) {
    secants.push((ys[k + 1]! - ys[k]!) / (xs[k + 1]! - xs[k]!));
  }
  const m: number[] = new Array<number>(n).fill(0);
  m[0] = secants[0] ?? 0;
  m[n - 1] = secants[n - 2] ?? 0;
  for (let k = 1; k < n - 1; k++) {
    const a = secants[k - 1]!;
    const b = secants[k]!;
    m[k] = a * b <= 0 ? 0 : (a + b) / 2;
  }
  for (let k = 0; k < n - 1; k++) {
    const d = secants[k]!;
    if (d === 0) {
      m[k] = 0;
      m[k + 1] = 0;
      continue;
    }
    const alpha = m[k]! / d;
    const beta = m[k + 1]! / d;
    const r = alpha * alpha + beta * beta;
    if (r > 9) {
      const tau = 3 / Math.sqrt(r);
      m[k] = tau * alpha * d;
      m[k + 1] = tau * beta * d;
    }
  }
  return m;
}

const tangentCache = new WeakMap<DensityPoint[], number[]>();

/** Monotone cubic interpolation of density over the table; x must lie within it. */
export function interpolateDensity(points: DensityPoint[], massFractionPct: number): number {
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) throw new Error("empty density table");
  if (points.length === 1 || massFractionPct <= first.massFractionPct) return first.densityGPerMl;
  if (massFractionPct >= last.massFractionPct) return last.densityGPerMl;
  let m = tangentCache.get(points);
  if (!m) {
    m = monotoneTangents(
      points.map((p) => p.massFractionPct),
      points.map((p) => p.densityGPerMl),
    );
    tangentCache.set(points, m);
  }
  let k = 0;
  while (k < points.length - 2 && points[k + 1]!.massFractionPct < massFractionPct) k++;
  const p0 = points[k]!;
  const p1 = points[k + 1]!;
  const h = p1.massFractionPct - p0.massFractionPct;
  const t = (massFractionPct - p0.massFractionPct) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (
    (2 * t3 - 3 * t2 + 1) * p0.densityGPerMl +
    (t3 - 2 * t2 + t) * h * m[k]! +
    (-2 * t3 + 3 * t2) * p1.densityGPerMl +
    (t3 - t2) * h * m[k + 1]!
  );
}

/** Highest mass fraction the tables can answer for: the table's end or saturation, whichever is lower. */
export function maxMassFractionPct(solute: AqueousSolute): number {
  const tableEnd = solute.points.value[solute.points.value.length - 1]?.massFractionPct ?? 0;
  const sat = solute.saturationWtPct?.value;
  return sat === undefined ? tableEnd : Math.min(tableEnd, sat);
}

function checkMassFraction(solute: AqueousSolute, massFractionPct: number, field: string): void {
  if (!Number.isFinite(massFractionPct) || massFractionPct < 0 || massFractionPct > 100) {
    throw new KnowledgeInputError(field, `A mass fraction must be between 0 and 100 % w/w (got ${massFractionPct}).`);
  }
  const sat = solute.saturationWtPct?.value;
  if (sat !== undefined && massFractionPct > sat + TOLERANCE) {
    throw new KnowledgeInputError(
      field,
      `${solute.name} saturates at about ${sat} % w/w at 20 °C; ${round(massFractionPct, 2)} % w/w is above saturation.`,
    );
  }
  const tableEnd = solute.points.value[solute.points.value.length - 1]?.massFractionPct ?? 0;
  if (massFractionPct > tableEnd + TOLERANCE) {
    throw new KnowledgeInputError(
      field,
      solute.key === "water"
        ? "Pure water has no dissolved solute; leave the concentration out."
        : `The density table for ${solute.name} ends at ${tableEnd} % w/w; ${round(massFractionPct, 2)} % w/w is beyond it.`,
    );
  }
}

/** Density at 20 °C of the solution with this mass % of solute (g/mL). */
export function densityAtMassFractionGPerMl(
  solute: AqueousSolute,
  massFractionPct: number,
  field = "aqueous.concentration",
): number {
  checkMassFraction(solute, massFractionPct, field);
  return interpolateDensity(solute.points.value, massFractionPct);
}

/** mol of solute per litre of solution at 20 °C: c = w·ρ·1000 / (100·M). */
export function molarityFromMassFraction(solute: AqueousSolute, massFractionPct: number, field = "aqueous.concentration"): number {
  const rho = densityAtMassFractionGPerMl(solute, massFractionPct, field);
  return (massFractionPct * rho * 10) / solute.molarMassGPerMol;
}

/** grams of solute per litre of solution at 20 °C: w·ρ·10. */
export function gramsPerLitreFromMassFraction(solute: AqueousSolute, massFractionPct: number, field = "aqueous.concentration"): number {
  return massFractionPct * densityAtMassFractionGPerMl(solute, massFractionPct, field) * 10;
}

/** Invert an increasing function of mass fraction on [0, wMax] by bisection. */
function invert(f: (w: number) => number, target: number, wMax: number): number {
  let lo = 0;
  let hi = wMax;
  for (let i = 0; i < 80 && hi - lo > 1e-10; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function fromPerVolume(
  solute: AqueousSolute,
  value: number,
  unitLabel: ConcentrationUnit,
  perVolume: (w: number) => number,
  field: string,
): number {
  if (!Number.isFinite(value) || value < 0) {
    throw new KnowledgeInputError(field, `A concentration must be zero or positive (got ${value} ${unitLabel}).`);
  }
  if (value === 0) return 0;
  const wMax = maxMassFractionPct(solute);
  const highest = perVolume(wMax);
  if (value > highest * (1 + 1e-9)) {
    const sat = solute.saturationWtPct?.value;
    const limit = sat !== undefined && sat <= wMax + TOLERANCE ? "saturation" : "the end of the density table";
    throw new KnowledgeInputError(
      field,
      solute.key === "water"
        ? "Pure water has no dissolved solute; leave the concentration out."
        : `${round(value, 3)} ${unitLabel} ${solute.name} is beyond ${limit} (at most about ${round(highest, 2)} ${unitLabel}, ${round(wMax, 1)} % w/w at 20 °C).`,
    );
  }
  return invert(perVolume, value, wMax);
}

/** Mass % of solute giving this molarity at 20 °C (solved against the density table). */
export function massFractionFromMolarity(solute: AqueousSolute, molPerL: number, field = "aqueous.concentration"): number {
  return fromPerVolume(solute, molPerL, "mol/L", (w) => molarityFromMassFraction(solute, w, field), field);
}

/** Mass % of solute giving this many g/L at 20 °C (solved against the density table). */
export function massFractionFromGramsPerLitre(solute: AqueousSolute, gPerL: number, field = "aqueous.concentration"): number {
  return fromPerVolume(solute, gPerL, "g/L", (w) => gramsPerLitreFromMassFraction(solute, w, field), field);
}

/** Any accepted concentration → mass % w/w. Pure water needs none; other solutes must have one. */
export function toMassFractionPct(
  solute: AqueousSolute,
  c: Concentration | undefined,
  field = "aqueous.concentration",
): number {
  if (c === undefined) {
    if (solute.key === "water") return 0;
    throw new KnowledgeInputError(field, `Give a concentration for ${solute.name} (mol/L, % w/w, g/L or "saturated").`);
  }
  if (c === "saturated") {
    const sat = solute.saturationWtPct;
    if (!sat) {
      throw new KnowledgeInputError(
        field,
        solute.key === "water"
          ? "Pure water cannot be saturated; leave the concentration out."
          : `${solute.name} has no saturation limit in the tables; give a concentration instead.`,
      );
    }
    checkMassFraction(solute, sat.value, field);
    return sat.value;
  }
  if (typeof c !== "object" || c === null || typeof c.value !== "number") {
    throw new KnowledgeInputError(field, 'A concentration is { value, unit } or "saturated".');
  }
  switch (c.unit) {
    case "%w/w":
      checkMassFraction(solute, c.value, field);
      return c.value;
    case "mol/L":
      return massFractionFromMolarity(solute, c.value, field);
    case "g/L":
      return massFractionFromGramsPerLitre(solute, c.value, field);
    default:
      throw new KnowledgeInputError(field, `Unknown concentration unit "${String((c as { unit: unknown }).unit)}"; use mol/L, %w/w or g/L.`);
  }
}

/** Mass % w/w → the requested unit (inverse of toMassFractionPct for that unit). */
export function fromMassFractionPct(
  solute: AqueousSolute,
  massFractionPct: number,
  unit: ConcentrationUnit,
  field = "aqueous.concentration",
): { value: number; unit: ConcentrationUnit } {
  switch (unit) {
    case "%w/w":
      checkMassFraction(solute, massFractionPct, field);
      return { value: massFractionPct, unit };
    case "mol/L":
      return { value: molarityFromMassFraction(solute, massFractionPct, field), unit };
    case "g/L":
      return { value: gramsPerLitreFromMassFraction(solute, massFractionPct, field), unit };
  }
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

// ── quantity parsing for form fields ─────────────────────────────────────────

export type QuantityKind = "volume" | "temperature" | "molarity" | "mass-fraction" | "mass-concentration" | "mass";

const CANONICAL: Record<QuantityKind, { unit: string; label: "mL" | "°C" | "mol/L" | "%w/w" | "g/L" | "g" }> = {
  volume: { unit: "mL", label: "mL" },
  temperature: { unit: "degC", label: "°C" },
  molarity: { unit: "mol/L", label: "mol/L" },
  "mass-fraction": { unit: "", label: "%w/w" },
  "mass-concentration": { unit: "g/L", label: "g/L" },
  mass: { unit: "g", label: "g" },
};

export interface ParsedQuantity {
  kind: QuantityKind;
  value: number;
  unit: "mL" | "°C" | "mol/L" | "%w/w" | "g/L" | "g";
}

const NUMBER = String.raw`[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?`;
const PERCENT = new RegExp(String.raw`^(${NUMBER})\s*(?:%|percent)\s*(?:\(?\s*(?:w\s*/\s*w|wt\.?|by\s+weight|m\s*/\s*m)\s*\)?)?$`, "i");
const BARE_NUMBER = new RegExp(String.raw`^${NUMBER}$`);

function normaliseUnitText(text: string): string {
  return text
    .trim()
    .replace(/\s+/g, " ") // a pasted no-break space reads as a space
    .replace(/(\d),(\d)/g, "$1.$2") // decimal comma
    .replace(/\s*[°º]\s*C\b/g, " degC")
    .replace(/\s*[°º]\s*F\b/g, " degF")
    .replace(/[µμ](?=[A-Za-z])/g, "u") // micro sign or Greek mu before a unit: mathjs spells it "u"
    .replace(/(\d|\s)mM\b/g, "$1mmol/L")
    .replace(/(\d|\s)uM\b/g, "$1umol/L")
    .replace(/(\d|\s)M\b/g, "$1mol/L")
    .replace(/\bmol\s*L-1\b/g, "mol/L")
    .replace(/\bg\s*L-1\b/g, "g/L")
    .replace(/\bmL\b/gi, "mL");
}

function kindOf(u: Unit): QuantityKind | undefined {
  const probes: [QuantityKind, string][] = [
    ["volume", "1 mL"],
    ["temperature", "1 degC"],
    ["molarity", "1 mol/L"],
    ["mass-concentration", "1 g/L"],
    ["mass", "1 g"],
  ];
  for (const [kind, probe] of probes) {
    if (u.equalBase(mathUnit(probe))) return kind;
  }
  return undefined;
}

/**
 * Parse a typed quantity ("0.5 L", "250 mL", "3 M", "10 %", "25 °C", "50 g/L") into its
 * canonical unit: mL, °C, mol/L, % w/w, g/L or g. A bare number takes the canonical unit of
 * `expected`. Throws KnowledgeInputError (field "quantity" unless given) when it cannot.
 */
export function parseQuantity(text: string, expected?: QuantityKind, field = "quantity"): ParsedQuantity {
  const raw = String(text ?? "").trim();
  if (raw === "") throw new KnowledgeInputError(field, "Enter a number with its unit.");
  const pct = PERCENT.exec(raw.replace(/(\d),(\d)/g, "$1.$2"));
  let result: ParsedQuantity | undefined;
  if (pct) {
    result = { kind: "mass-fraction", value: Number(pct[1]), unit: "%w/w" };
  } else {
    const normal = normaliseUnitText(raw);
    if (BARE_NUMBER.test(normal)) {
      if (!expected) throw new KnowledgeInputError(field, `"${raw}" has no unit.`);
      result = { kind: expected, value: Number(normal), unit: CANONICAL[expected].label };
    } else {
      let u: Unit;
      try {
        u = mathUnit(normal);
      } catch {
        throw new KnowledgeInputError(field, `"${raw}" is not a quantity this tool understands (try "250 mL", "1 M", "10 %", "25 °C").`);
      }
      const kind = kindOf(u);
      if (!kind) throw new KnowledgeInputError(field, `"${raw}" is not a volume, temperature, concentration or mass.`);
      result = { kind, value: u.toNumber(CANONICAL[kind].unit), unit: CANONICAL[kind].label };
    }
  }
  if (!Number.isFinite(result.value)) throw new KnowledgeInputError(field, `"${raw}" is not a finite number.`);
  if (expected && result.kind !== expected) {
    throw new KnowledgeInputError(field, `"${raw}" is a ${result.kind.replace("-", " ")}, not a ${expected.replace("-", " ")}.`);
  }
  return result;
}

/** "250 mL", "0.5 L", "250" → mL. */
export function parseVolumeMl(text: string, field = "volumeMl"): number {
  return parseQuantity(text, "volume", field).value;
}

/** "25 °C", "298.15 K", "25" → °C. */
export function parseTemperatureC(text: string, field = "temperatureC"): number {
  return parseQuantity(text, "temperature", field).value;
}

/** "1 M", "10 %", "50 g/L", "sat." → a Concentration. */
export function parseConcentration(text: string, field = "aqueous.concentration"): Concentration {
  const raw = String(text ?? "").trim();
  if (/^(sat(\.|urated)?)$/i.test(raw)) return "saturated";
  const q = parseQuantity(raw, undefined, field);
  switch (q.kind) {
    case "molarity":
      return { value: q.value, unit: "mol/L" };
    case "mass-fraction":
      return { value: q.value, unit: "%w/w" };
    case "mass-concentration":
      return { value: q.value, unit: "g/L" };
    default:
      throw new KnowledgeInputError(field, `"${raw}" is not a concentration (try "1 M", "10 %", "50 g/L" or "saturated").`);
  }
}
