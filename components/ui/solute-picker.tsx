import { useMemo } from "react";
import { SHIPPED_REFERENCE, normaliseName, suggestSolutes } from "../../knowledge/reference";
import type { AqueousSolute, ReferenceData } from "../../knowledge/types";
import { formatPercent } from "./format";
import { NamePicker, type PickerRow } from "./name-picker";

/** Offered before anything is typed: the usual work-up washes, with the concentration they imply. */
const COMMON_WASHES: { key: string; title?: string; concentration?: string }[] = [
  { key: "water" },
  { key: "sodium-chloride", title: "Brine (saturated NaCl)", concentration: "saturated" },
  { key: "sodium-bicarbonate", title: "Saturated NaHCO3", concentration: "saturated" },
  { key: "ammonium-chloride", title: "Saturated NH4Cl", concentration: "saturated" },
  { key: "hydrochloric-acid", title: "1 M HCl", concentration: "1 M" },
  { key: "sodium-hydroxide", title: "1 M NaOH", concentration: "1 M" },
];

/** "sat. brine", "saturated NaCl", "brine": the typed text itself says saturated. */
function impliesSaturated(typed: string): boolean {
  const t = typed.toLowerCase();
  if (/\bhalf/.test(t)) return false;
  return /\bsat(\.|urated|\b)/.test(t) || normaliseName(t) === "brine";
}

/** "1 M HCl", "10 % NaCl", "5% NaHCO3": a concentration typed in front of the name. */
export function splitLeadingConcentration(typed: string): { concentration?: string; name: string } {
  const m = /^\s*(\d+(?:[.,]\d+)?\s*(?:M|mol\/L|%|g\/L))\s+(.+)$/i.exec(typed);
  return m ? { concentration: m[1]!.trim(), name: m[2]!.trim() } : { name: typed };
}

function detail(s: AqueousSolute): string {
  const sat = s.saturationWtPct ? `saturated at ${formatPercent(s.saturationWtPct.value)} w/w` : undefined;
  return [s.formula, sat].filter(Boolean).join(" · ");
}

const row = (s: AqueousSolute): PickerRow<AqueousSolute> => ({ item: s, title: s.name, detail: detail(s) });

export interface SolutePickerProps {
  /** visible label; "Aqueous phase" by default */
  label?: string;
  /** the chosen solute's key ("water" for plain water), or null */
  value: string | null;
  /**
   * Called with the solute's key and, when the pick implies one, a concentration as a chemist
   * types it ("saturated" for "sat. brine", "1 M" for the "1 M HCl" row).
   */
  onChange: (soluteKey: string, concentrationText?: string) => void;
  /** tables to pick from (a group's corrected tables); the shipped tables by default */
  reference?: ReferenceData;
  /** a problem with the choice (e.g. from the computation), shown under the picker */
  error?: string;
  testID?: string;
}

/** Pick the aqueous phase: "water", "brine", "NaHCO3", "sat. bicarb", "caustic soda"… Fuzzy and offline. */
export function SolutePicker({ label = "Aqueous phase", value, onChange, reference = SHIPPED_REFERENCE, error, testID }: SolutePickerProps) {
  const common = useMemo(
    () =>
      COMMON_WASHES.flatMap((c) => {
        const s = reference.solutes.find((x) => x.key === c.key);
        return s ? [{ item: s, title: c.title ?? s.name, detail: detail(s), preset: c.concentration }] : [];
      }),
    [reference],
  );
  const chosen = value ? reference.solutes.find((s) => s.key === value) : undefined;
  return (
    <NamePicker
      label={label}
      chosen={chosen ? row(chosen) : null}
      common={common}
      search={(q) => {
        const typed = splitLeadingConcentration(q);
        return suggestSolutes(typed.name, reference, 6).map((s) => ({ ...row(s), preset: typed.concentration }));
      }}
      onPick={(r, typed) => onChange(r.item.key, r.preset ?? (impliesSaturated(typed) && r.item.saturationWtPct ? "saturated" : undefined))}
      placeholder="Water, brine, NaHCO3, 1 M HCl…"
      noMatch={(q) => `No aqueous solution in the tables matches “${q}”. Try the salt, acid or base by name or formula.`}
      error={error}
      testID={testID}
    />
  );
}
