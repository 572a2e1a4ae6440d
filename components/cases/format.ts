import type { CaseSystem } from "../../knowledge/contracts/cases";
import { formatVolumeMl } from "../ui/format";
import type { Concentration } from "../../knowledge/types";


const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** "14 Mar 2025": unambiguous whatever the device locale. */
export function formatDate(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.getDate()} ${MONTHS[d.getMonth()]} ${d.getFullYear()}`;
}

export function formatDateTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const hh = String(d.getHours()).padStart(2, "0");
  const mm = String(d.getMinutes()).padStart(2, "0");
  return `${formatDate(iso)}, ${hh}:${mm}`;
}

export function formatMinutes(min: number): string {
  if (min < 60) return `${Number(min.toFixed(1))} min`;
  const h = Math.floor(min / 60);
  const m = Math.round(min % 60);
  return m ? `${h} h ${m} min` : `${h} h`;
}

/** A table name inside a sentence: "Sodium bicarbonate" → "sodium bicarbonate"; "THF", "N,N-…" stay. */
export function inSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name.charAt(0).toLowerCase() + name.slice(1) : name;
}

/** "50 mL dichloromethane + 10 mL methanol" */
export function organicLine(system: CaseSystem): string {
  return system.organic.map((o) => `${formatVolumeMl(o.volumeMl)} ${inSentence(o.name || o.solvent)}`).join(" + ");
}

/** "50 mL saturated sodium bicarbonate, pH 8.3" */
export function aqueousLine(system: CaseSystem): string {
  const a = system.aqueous;
  const conc = formatConcentration(a.concentration);
  const ph = a.ph !== undefined ? `, pH ${a.ph.toFixed(1)}` : "";
  return `${formatVolumeMl(a.volumeMl)} ${conc ? `${conc} ` : ""}${inSentence(a.name || a.solute)}${ph}`;
}

/** A concentration as a chemist types it ("1 M", "10 %", "saturated"), for form fields and lines. */
export function formatConcentration(c: Concentration | undefined): string {
  if (!c) return "";
  if (c === "saturated") return "saturated";
  const unit = c.unit === "mol/L" ? "M" : c.unit === "%w/w" ? "%" : "g/L";
  return `${c.value} ${unit}`;
}
