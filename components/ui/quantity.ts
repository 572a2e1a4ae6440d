/* Reading typed quantities for the form fields: pure, shared by QuantityField and the screens that use it. */
import { parseConcentration, parseQuantity, type QuantityKind } from "../../knowledge/concentration";
import type { Concentration } from "../../knowledge/types";
import { KnowledgeInputError } from "../../knowledge/types";
import { formatConcentration, formatTemperatureC, formatVolumeMl, trimNumber } from "./format";

export type QuantityFieldKind = QuantityKind | "concentration";

export type QuantityReading =
  | { ok: true; value: number; concentration?: Concentration; display: string }
  | { ok: false; empty: boolean; message: string };

function display(kind: QuantityKind, value: number, unit: string): string {
  if (kind === "volume") return formatVolumeMl(value);
  if (kind === "temperature") return formatTemperatureC(value);
  return `${trimNumber(value, 3)} ${unit}`;
}

/**
 * Read what was typed into a quantity field ("0.5 L", "3 M", "10 %", "25 °C", "sat."): the
 * canonical value (mL, °C, mol/L, % w/w, g/L, g) and how to show it, or why it cannot be read.
 * For "concentration", `concentration` carries the parsed value and `value` is NaN when saturated.
 */
export function readQuantity(kind: QuantityFieldKind, text: string): QuantityReading {
  if (text.trim() === "") return { ok: false, empty: true, message: "Enter a value." };
  try {
    if (kind === "concentration") {
      const c = parseConcentration(text);
      return { ok: true, value: c === "saturated" ? Number.NaN : c.value, concentration: c, display: formatConcentration(c) };
    }
    const q = parseQuantity(text, kind);
    return { ok: true, value: q.value, display: display(kind, q.value, q.unit) };
  } catch (e) {
    if (e instanceof KnowledgeInputError) return { ok: false, empty: false, message: e.message };
    throw e;
  }
}

