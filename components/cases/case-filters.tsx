import { StyleSheet, View } from "react-native";
import { useLayout } from "../../hooks/breakpoints";
import { space } from "../../hooks/theme";
import type { CaseFilters } from "../../hooks/use-cases";
import type { GroupMember } from "../../hooks/use-me";
import type { AttemptOutcome, CaseStatus } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { ChoiceChips, ToggleChips, type Choice } from "./choice-chips";
import { CAUSE_CHOICES, OUTCOME_CHOICES, REMEDY_CHOICES, STATUS_CHOICES } from "./vocab";

/** What the filter panel holds; strings as typed, so a half-typed date does not vanish. */
export interface FilterState {
  q: string;
  solvent: string;
  aqueous: string;
  cause: string | null;
  remedy: string | null;
  outcome: AttemptOutcome | null;
  status: CaseStatus | null;
  author: string | null;
  from: string;
  to: string;
  verified: boolean;
}

export const EMPTY_FILTERS: FilterState = {
  q: "",
  solvent: "",
  aqueous: "",
  cause: null,
  remedy: null,
  outcome: null,
  status: null,
  author: null,
  from: "",
  to: "",
  verified: false,
};

const DATE = /^\d{4}-\d{2}-\d{2}$/;

export function dateProblem(text: string): string | undefined {
  const t = text.trim();
  if (!t) return undefined;
  if (!DATE.test(t) || Number.isNaN(Date.parse(t))) return "Use a date like 2025-03-14.";
  return undefined;
}

/** The list query for the server: empty and half-typed values are left out. */
export function toQuery(f: FilterState): CaseFilters {
  return {
    q: f.q.trim() || undefined,
    solvent: f.solvent.trim() || undefined,
    aqueous: f.aqueous.trim() || undefined,
    cause: f.cause ?? undefined,
    remedy: f.remedy ?? undefined,
    outcome: f.outcome ?? undefined,
    status: f.status ?? undefined,
    author: f.author ?? undefined,
    from: dateProblem(f.from) ? undefined : f.from.trim() || undefined,
    to: dateProblem(f.to) ? undefined : f.to.trim() || undefined,
    verified: f.verified ? "true" : undefined,
  };
}

/** How many filters (beyond the search box) are on. */
export function activeFilterCount(f: FilterState): number {
  const { q: _q, ...rest } = f;
  return Object.values(rest).filter((v) => v !== null && v !== "" && v !== false).length;
}

export function CaseFilterPanel({
  value,
  onChange,
  members,
  userId,
}: {
  value: FilterState;
  onChange: (f: FilterState) => void;
  members: GroupMember[];
  userId: string;
}) {
  // Long chip lists scroll sideways on a phone; a wide screen has room to wrap them.
  const phone = useLayout() === "phone";
  const set = <K extends keyof FilterState>(k: K, v: FilterState[K]) => onChange({ ...value, [k]: v });
  const authors: Choice<string>[] = [
    { value: "me", label: "Mine" },
    ...members.filter((m) => m.userId !== userId).map((m) => ({ value: m.userId, label: m.name })),
  ];
  return (
    <View style={styles.panel} testID="case-filters">
      <View style={styles.row}>
        <View style={styles.cell}>
          <Field label="Solvent" value={value.solvent} onChangeText={(t) => set("solvent", t)} placeholder="any name: DCM, EtOAc" autoCapitalize="none" testID="filter-solvent" />
        </View>
        <View style={styles.cell}>
          <Field label="Aqueous phase" value={value.aqueous} onChangeText={(t) => set("aqueous", t)} placeholder="brine, bicarb, HCl" autoCapitalize="none" testID="filter-aqueous" />
        </View>
      </View>
      <ChoiceChips label="Status" choices={STATUS_CHOICES} value={value.status} onChange={(v) => set("status", v)} testID="filter-status" />
      <ChoiceChips label="Remedy tried" choices={REMEDY_CHOICES} value={value.remedy} onChange={(v) => set("remedy", v)} scroll={phone} testID="filter-remedy" />
      <ChoiceChips
        label={value.remedy ? "…with the outcome" : "An attempt's outcome"}
        choices={OUTCOME_CHOICES}
        value={value.outcome}
        onChange={(v) => set("outcome", v)}
        testID="filter-outcome"
      />
      <ChoiceChips label="Suspected cause" choices={CAUSE_CHOICES} value={value.cause} onChange={(v) => set("cause", v)} scroll={phone} testID="filter-cause" />
      <ChoiceChips label="Logged by" choices={authors} value={value.author} onChange={(v) => set("author", v)} scroll={phone} testID="filter-author" />
      <View style={styles.row}>
        <View style={styles.cell}>
          <Field label="From" value={value.from} onChangeText={(t) => set("from", t)} placeholder="2025-01-31" error={dateProblem(value.from)} testID="filter-from" />
        </View>
        <View style={styles.cell}>
          <Field label="To" value={value.to} onChangeText={(t) => set("to", t)} placeholder="2025-12-31" error={dateProblem(value.to)} testID="filter-to" />
        </View>
      </View>
      <ToggleChips
        label="Checked by a lead"
        choices={[{ value: "verified", label: "Checked cases only" }]}
        values={value.verified ? ["verified"] : []}
        onChange={(v) => set("verified", v.length > 0)}
        testID="filter"
      />
      {activeFilterCount(value) ? <Button label="Clear filters" variant="quiet" onPress={() => onChange({ ...EMPTY_FILTERS, q: value.q })} testID="filters-clear" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  cell: { flexGrow: 1, flexBasis: 180 },
});
