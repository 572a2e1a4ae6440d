import { MBAR_PER_MMHG, resolveWash } from "../../knowledge/plan";
import type { PlanDocument } from "../../knowledge/contracts/plans";
import { findSolvent, SHIPPED_REFERENCE } from "../../knowledge/reference";
import type { ReferenceData } from "../../knowledge/types";
import { formatConcentration, formatVolumeMl, trimNumber } from "../ui/format";
import { solventAbbreviation } from "../ui/solvent-picker";

/* The plan's numbers as UX.md asks: pH to 1 decimal, shares as % to 1 decimal, pressures in mbar with mmHg. */

/** pH to 1 decimal; never "−0.0". */
export function formatPh(pH: number): string {
  const r = Math.round(pH * 10) / 10;
  return (Object.is(r, -0) || r === 0 ? 0 : r).toFixed(1);
}

/**
 * A share of the starting amount as a percentage, 1 decimal; the extremes say so rather than
 * round to 0 or 100 (an equilibrium never moves everything, and sums of shares round up to 1).
 */
export function formatShare(fraction: number): string {
  const pct = fraction * 100;
  if (pct <= 0) return "0 %";
  if (pct < 0.05) return "< 0.1 %";
  if (pct >= 99.95) return "> 99.9 %";
  return `${pct.toFixed(1)} %`;
}

export function formatMbar(mbar: number): string {
  const digits = mbar < 10 ? 1 : 0;
  return `${mbar.toFixed(digits)} mbar (${(mbar / MBAR_PER_MMHG).toFixed(digits)} mmHg)`;
}

export function formatMmol(mmol: number): string {
  return `${mmol < 0.1 ? trimNumber(mmol, 3) : trimNumber(mmol, 2)} mmol`;
}

export function formatDegrees(c: number): string {
  return `${Math.round(c)} °C`;
}

/** "ethyl acetate (EtOAc)" for a key or a typed name. */
export function solventLabel(query: string, ref: ReferenceData = SHIPPED_REFERENCE): string {
  const s = findSolvent(query, ref);
  if (!s) return query;
  const abbr = solventAbbreviation(s);
  return abbr ? `${s.name} (${abbr})` : s.name;
}

/** "1 M hydrochloric acid", "saturated sodium bicarbonate". */
export function washLabel(w: PlanDocument["washes"][number], ref: ReferenceData = SHIPPED_REFERENCE): string {
  let name = w.aqueous.solute;
  try {
    name = resolveWash(w.aqueous.solute, ref).chem.name;
  } catch {
    /* keep what was typed */
  }
  const c = w.aqueous.concentration;
  if (c === undefined) return name;
  const conc = c === "saturated" ? "saturated" : c.unit === "mol/L" ? `${trimNumber(c.value, 3)} M` : formatConcentration(c);
  return `${conc} ${name}`;
}

/** Bench shorthand: "1 M HCl", "sat. NaHCO3", "water". */
export function washShortLabel(w: { aqueous: { solute: string; concentration?: PlanDocument["washes"][number]["aqueous"]["concentration"] } }, ref: ReferenceData = SHIPPED_REFERENCE): string {
  let formula = w.aqueous.solute;
  try {
    const chem = resolveWash(w.aqueous.solute, ref).chem;
    formula = chem.soluteKey === "water" ? "water" : chem.formula;
  } catch {
    /* keep what was typed */
  }
  const c = w.aqueous.concentration;
  if (c === undefined) return formula;
  const conc = c === "saturated" ? "sat." : c.unit === "mol/L" ? `${trimNumber(c.value, 3)} M` : formatConcentration(c).replace(" w/w", "");
  return `${conc} ${formula}`;
}

/** "2 × 25 mL" or "25 mL". */
export function portionsLabel(w: PlanDocument["washes"][number]): string {
  const r = w.repeats ?? 1;
  return r > 1 ? `${r} × ${formatVolumeMl(w.volumeMl)}` : formatVolumeMl(w.volumeMl);
}
