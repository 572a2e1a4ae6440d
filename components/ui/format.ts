import type { Concentration } from "../../knowledge/types";

/*
 * Number formats from the house rules (UX.md): densities and their differences to 3 decimals,
 * volumes in mL (L from 1000 mL), temperatures in °C, fractions as percentages.
 */

/** At most `digits` decimals, without trailing zeros: 40 → "40", 2.50 → "2.5". */
export function trimNumber(x: number, digits = 2): string {
  return String(Number(x.toFixed(digits)));
}

export function formatDensity(gPerMl: number): string {
  return `${gPerMl.toFixed(3)} g/mL`;
}

export function formatVolumeMl(ml: number): string {
  return ml >= 1000 ? `${trimNumber(ml / 1000, 3)} L` : `${trimNumber(ml, 1)} mL`;
}

export function formatTemperatureC(c: number): string {
  return `${trimNumber(c, 1)} °C`;
}

/** A mass fraction as a percentage: 1 decimal, 0.1 % steps below 1 % shown as such. */
export function formatPercent(pct: number): string {
  return `${pct < 1 && pct > 0 ? trimNumber(pct, 2) : trimNumber(pct, 1)} %`;
}

export function formatConcentration(c: Concentration): string {
  if (c === "saturated") return "saturated";
  switch (c.unit) {
    case "mol/L":
      return `${trimNumber(c.value, 3)} mol/L`;
    case "%w/w":
      return `${formatPercent(c.value)} w/w`;
    case "g/L":
      return `${trimNumber(c.value, 1)} g/L`;
  }
}
