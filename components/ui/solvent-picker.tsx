import { useMemo } from "react";
import { SHIPPED_REFERENCE, normaliseName, suggestSolvents } from "../../knowledge/reference";
import type { ReferenceData, Solvent } from "../../knowledge/types";
import { formatDensity } from "./format";
import { NamePicker, type PickerRow } from "./name-picker";

/** Offered before anything is typed: the usual extraction solvents. */
const COMMON_SOLVENTS = ["dichloromethane", "ethyl-acetate", "diethyl-ether", "mtbe", "toluene", "heptane", "2-methyltetrahydrofuran", "chloroform"];

const MISCIBILITY: Record<Solvent["miscibility"]["value"], string> = {
  immiscible: "not miscible with water",
  partial: "partly miscible with water",
  miscible: "mixes with water",
};

/** The short name chemists write: "DCM", "EtOAc", "Et2O" (the first short synonym that is not the formula). */
export function solventAbbreviation(s: Pick<Solvent, "synonyms" | "formula">): string | undefined {
  return s.synonyms.find((x) => x.length <= 7 && !x.includes(" ") && x !== s.formula);
}

/** The name the query matched when it is not the solvent's own name ("methylene chloride"). */
function matchedAlias(s: Solvent, query: string): string | undefined {
  const q = normaliseName(query);
  if (q === "" || normaliseName(s.name).startsWith(q)) return undefined;
  return [...s.synonyms, s.cas, s.formula].find((n) => normaliseName(n).startsWith(q));
}

function row(s: Solvent, query = ""): PickerRow<Solvent> {
  const alias = matchedAlias(s, query);
  const abbr = solventAbbreviation(s);
  const parts = [alias ? `“${alias}”` : abbr, `${formatDensity(s.densityGPerMl20C.value)} at 20 °C`, MISCIBILITY[s.miscibility.value]];
  return { item: s, title: s.name, detail: parts.filter(Boolean).join(" · ") };
}

export interface SolventPickerProps {
  /** visible label; "Organic solvent" by default */
  label?: string;
  /** the chosen solvent's key, or null */
  value: string | null;
  onChange: (solventKey: string) => void;
  /** tables to pick from (a group's corrected tables); the shipped tables by default */
  reference?: ReferenceData;
  /** a problem with the choice (e.g. from the computation), shown under the picker */
  error?: string;
  /** offer water as well (the organic phase never is water, so off by default) */
  includeWater?: boolean;
  testID?: string;
}

/**
 * Pick a solvent by anything a chemist types: name, abbreviation ("DCM"), synonym
 * ("methylene chloride"), formula ("CH2Cl2") or CAS number ("75-09-2"). Fuzzy, from the
 * knowledge module, so it works offline.
 */
export function SolventPicker({ label = "Organic solvent", value, onChange, reference = SHIPPED_REFERENCE, error, includeWater, testID }: SolventPickerProps) {
  const allowed = (s: Solvent) => includeWater || s.family !== "water";
  const common = useMemo(
    () => COMMON_SOLVENTS.map((k) => reference.solvents.find((s) => s.key === k)).filter((s): s is Solvent => !!s).map((s) => row(s)),
    [reference],
  );
  const chosen = value ? reference.solvents.find((s) => s.key === value) : undefined;
  return (
    <NamePicker
      label={label}
      chosen={chosen ? row(chosen) : null}
      common={common}
      search={(q) => suggestSolvents(q, reference, 7).filter(allowed).slice(0, 6).map((s) => row(s, q))}
      onPick={(r) => onChange(r.item.key)}
      placeholder="Name, abbreviation, formula or CAS"
      noMatch={(q) => `No solvent in the tables matches “${q}”. Try its full name, an abbreviation or the CAS number.`}
      error={error}
      testID={testID}
    />
  );
}
