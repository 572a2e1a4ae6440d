import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { interpolateDensity } from "../../knowledge/concentration";
import {
  AQUEOUS_DENSITY_RANGE,
  SOLVENT_VALUE_FIELDS,
  SOLVENT_VALUE_FIELD_KEYS,
  type ComparedValue,
  type CreateOverrideBody,
  type OverrideView,
} from "../../knowledge/contracts/reference-overrides";
import type { SolventValueField } from "../../knowledge/overrides";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { useDraft } from "../../hooks/use-draft";
import {
  useCreateOverrideMutation,
  useOverridesQuery,
  useRetireOverrideMutation,
  useSoluteComparisonQuery,
  useSolventComparisonQuery,
} from "../../hooks/use-reference-overrides";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { SolutePicker } from "../ui/solute-picker";
import { SolventPicker } from "../ui/solvent-picker";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { DataTable, type Column } from "./data-table";
import type { DeskSectionProps } from "./desk-sections";
import { formatDay, formatValue } from "./format";

type Kind = "solvent-value" | "aqueous-point";

interface CorrectionDraft {
  kind: Kind;
  solventKey: string | null;
  field: SolventValueField;
  soluteKey: string | null;
  value: string;
  massFractionPct: string;
  source: string;
  reason: string;
}

const EMPTY: CorrectionDraft = {
  kind: "solvent-value",
  solventKey: null,
  field: "densityGPerMl20C",
  soluteKey: null,
  value: "",
  massFractionPct: "",
  source: "",
  reason: "",
};

/** "1,327" and "1.327 g/mL" both read as 1.327; anything else is not a number. */
function parseNumber(text: string): number | undefined {
  const m = text.trim().replace(",", ".").match(/^-?\d+(\.\d+)?/);
  return m ? Number(m[0]) : undefined;
}

const lowerFirst = (s: string) => s.charAt(0).toLowerCase() + s.slice(1);

function decimalsOf(o: Pick<OverrideView, "kind" | "payload">): number {
  return o.payload.kind === "solvent-value" ? SOLVENT_VALUE_FIELDS[o.payload.field].decimals : 4;
}

function Compared({ v, decimals, unit, testID }: { v: ComparedValue; decimals: number; unit: string; testID?: string }) {
  return (
    <View testID={testID}>
      <Text bold>{formatValue(v.value, decimals, unit)}</Text>
      <Text size="caption" tone="inkMuted">
        {v.sourceTitle}
        {v.note ? ` — ${v.note}` : ""}
      </Text>
    </View>
  );
}

/** The shipped value (and the group's current one) of what is being corrected, before saving. */
function CurrentValues({ draft }: { draft: CorrectionDraft }) {
  const solvent = useSolventComparisonQuery(draft.kind === "solvent-value" ? draft.solventKey : null);
  const solute = useSoluteComparisonQuery(draft.kind === "aqueous-point" ? draft.soluteKey : null);
  if (draft.kind === "solvent-value") {
    if (!solvent.data) return null;
    const f = SOLVENT_VALUE_FIELDS[draft.field];
    const shipped = solvent.data.shipped[draft.field];
    const group = solvent.data.group[draft.field];
    const same = shipped?.value === group?.value && shipped?.source === group?.source;
    return (
      <Notice tone="info" testID="current-values">
        <Text>
          Shipped: {formatValue(shipped?.value ?? null, f.decimals, f.unit)} ({shipped?.sourceTitle ?? "no source"})
        </Text>
        {same ? null : (
          <Text>
            In force for the group: {formatValue(group?.value ?? null, f.decimals, f.unit)} ({group?.sourceTitle})
          </Text>
        )}
      </Notice>
    );
  }
  const w = parseNumber(draft.massFractionPct);
  if (!solute.data || w === undefined) return null;
  const shipped = solute.data.shippedPoints.value;
  const end = shipped[shipped.length - 1]?.massFractionPct ?? 0;
  return (
    <Notice tone="info" testID="current-values">
      <Text>
        {w > end
          ? `The shipped table for ${solute.data.name} ends at ${end} % w/w: this point extends it.`
          : `Shipped at ${w} % w/w: ${interpolateDensity(shipped, w).toFixed(4)} g/mL (${solute.data.shippedPoints.sourceTitle}${
              shipped.some((p) => p.massFractionPct === w) ? "" : ", interpolated"
            }).`}
      </Text>
    </Notice>
  );
}

function AddCorrection({ userId }: { userId: string }) {
  const draft = useDraft<CorrectionDraft>(`desk.reference.${userId}`, EMPTY);
  const d = draft.value;
  const set = (patch: Partial<CorrectionDraft>) => draft.set((prev) => ({ ...prev, ...patch }));
  const create = useCreateOverrideMutation();
  const [local, setLocal] = useState<Record<string, string>>({});
  const err = create.error instanceof ApiError ? create.error : null;
  const fieldError = (name: string) => local[name] ?? err?.fields?.[name];
  const f = SOLVENT_VALUE_FIELDS[d.field];

  const submit = () => {
    const problems: Record<string, string> = {};
    const value = parseNumber(d.value);
    const w = parseNumber(d.massFractionPct);
    if (d.kind === "solvent-value" && !d.solventKey) problems.solventKey = "Pick a solvent.";
    if (d.kind === "aqueous-point" && !d.soluteKey) problems.soluteKey = "Pick a solution.";
    if (value === undefined) problems[d.kind === "solvent-value" ? "value" : "densityGPerMl"] = "Give the value as a number.";
    if (d.kind === "aqueous-point" && w === undefined) problems.massFractionPct = "Give the concentration in % w/w.";
    setLocal(problems);
    if (Object.keys(problems).length) return;
    const provenance = { source: d.source, reason: d.reason };
    const body: CreateOverrideBody =
      d.kind === "solvent-value"
        ? { kind: "solvent-value", solventKey: d.solventKey!, field: d.field, value: value!, ...provenance }
        : { kind: "aqueous-point", soluteKey: d.soluteKey!, massFractionPct: w!, densityGPerMl: value!, ...provenance };
    create.mutate(body, { onSuccess: () => draft.clear() });
  };

  return (
    <Card>
      <Text size="title" bold>
        Correct or add a value
      </Text>
      <Text tone="inkMuted">
        The group&apos;s value replaces the shipped one in every computation for this group only. A source and a reason are required.
      </Text>
      <Chips
        label="What to correct"
        options={[
          { value: "solvent-value", label: "Solvent value" },
          { value: "aqueous-point", label: "Aqueous density point" },
        ]}
        selected={d.kind}
        onSelect={(kind) => set({ kind })}
        testID="correction-kind"
      />
      {d.kind === "solvent-value" ? (
        <>
          <SolventPicker label="Solvent" value={d.solventKey} onChange={(solventKey) => set({ solventKey })} error={fieldError("solventKey")} includeWater testID="correction-solvent" />
          <Chips
            label="Value"
            showLabel
            options={SOLVENT_VALUE_FIELD_KEYS.map((k) => ({ value: k, label: SOLVENT_VALUE_FIELDS[k].label }))}
            selected={d.field}
            onSelect={(field) => set({ field })}
            testID="correction-field"
          />
          <Field
            label={`${f.label} (${f.unit})`}
            value={d.value}
            onChangeText={(value) => set({ value })}
            inputMode="decimal"
            help={`Between ${f.min} and ${f.max} ${f.unit}.`}
            error={fieldError("value") ?? fieldError("field")}
            testID="correction-value"
          />
        </>
      ) : (
        <>
          <SolutePicker label="Aqueous solution" value={d.soluteKey} onChange={(soluteKey) => set({ soluteKey })} error={fieldError("soluteKey")} testID="correction-solute" />
          <Field
            label="Concentration (% w/w)"
            value={d.massFractionPct}
            onChangeText={(massFractionPct) => set({ massFractionPct })}
            inputMode="decimal"
            error={fieldError("massFractionPct")}
            testID="correction-fraction"
          />
          <Field
            label="Density at 20 °C (g/mL)"
            value={d.value}
            onChangeText={(value) => set({ value })}
            inputMode="decimal"
            help={`Between ${AQUEOUS_DENSITY_RANGE.min} and ${AQUEOUS_DENSITY_RANGE.max} g/mL.`}
            error={fieldError("densityGPerMl")}
            testID="correction-density"
          />
        </>
      )}
      <CurrentValues draft={d} />
      <Field
        label="Source"
        value={d.source}
        onChangeText={(source) => set({ source })}
        placeholder="SDS section 9, handbook table, pycnometer reading…"
        error={fieldError("source")}
        testID="correction-source"
      />
      <Field
        label="Reason"
        value={d.reason}
        onChangeText={(reason) => set({ reason })}
        placeholder="Why the shipped value is not right for this group"
        multiline
        error={fieldError("reason")}
        testID="correction-reason"
      />
      {err && !err.fields ? <Notice tone="danger">{err.message}</Notice> : null}
      {create.data && !create.isPending ? (
        <Notice tone="good" testID="correction-saved">
          <Text>
            Saved: {create.data.targetName}, {lowerFirst(create.data.label)} = {formatValue(create.data.group.value, decimalsOf(create.data), create.data.unit)} for the group
            (shipped {formatValue(create.data.shipped.value, decimalsOf(create.data), create.data.unit)}).
          </Text>
        </Notice>
      ) : null}
      <Button label="Save correction" busy={create.isPending} onPress={submit} testID="correction-save" />
    </Card>
  );
}

function RetireControl({ o }: { o: OverrideView }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState("");
  const retire = useRetireOverrideMutation();
  const err = retire.error instanceof ApiError ? retire.error : null;
  if (!open) return <Button variant="secondary" label="Retire…" onPress={() => setOpen(true)} testID={`retire-${o.id}`} />;
  return (
    <View style={styles.retire}>
      <Field label="Why retire it?" value={reason} onChangeText={setReason} error={err?.fields?.reason ?? err?.message} testID={`retire-reason-${o.id}`} />
      <View style={styles.buttons}>
        <Button variant="danger" label="Retire correction" busy={retire.isPending} onPress={() => retire.mutate({ id: o.id, reason })} testID={`retire-confirm-${o.id}`} />
        <Button variant="quiet" label="Keep it" onPress={() => setOpen(false)} />
      </View>
      <Text size="caption" tone="inkMuted">
        Retired corrections stay in the list and the audit log; the shipped value applies again.
      </Text>
    </View>
  );
}

function columns(): Column<OverrideView>[] {
  return [
    {
      key: "what",
      title: "Value",
      flex: 1.3,
      sortValue: (o) => `${o.targetName} ${o.label}`,
      render: (o) => (
        <View>
          <Text bold>{o.targetName}</Text>
          <Text size="caption">{o.label}</Text>
          {o.retiredAt ? (
            <Text size="caption" tone="caution">
              Retired {formatDay(o.retiredAt)}: {o.retiredReason}
            </Text>
          ) : !o.applies ? (
            <Text size="caption" tone="danger">
              No longer fits the shipped tables; not applied.
            </Text>
          ) : null}
        </View>
      ),
    },
    { key: "shipped", title: "Shipped", render: (o) => <Compared v={o.shipped} decimals={decimalsOf(o)} unit={o.unit} /> },
    {
      key: "group",
      title: "Group",
      sortValue: (o) => o.group.value ?? 0,
      render: (o) => <Compared v={o.group} decimals={decimalsOf(o)} unit={o.unit} testID={`group-value-${o.targetKey}`} />,
    },
    { key: "reason", title: "Why", flex: 1.4, render: (o) => o.reason },
    {
      key: "who",
      title: "Changed",
      sortValue: (o) => o.createdAt,
      render: (o) => (
        <View>
          <Text>{o.createdBy?.name ?? "—"}</Text>
          <Text size="caption" tone="inkMuted">
            {formatDay(o.createdAt)}
          </Text>
        </View>
      ),
    },
  ];
}

function Corrections({ canAct }: { canAct: boolean }) {
  const [showRetired, setShowRetired] = useState(false);
  const q = useOverridesQuery(showRetired ? "all" : "active");
  return (
    <Card>
      <View style={styles.heading}>
        <Text size="title" bold>
          {showRetired ? "All corrections" : "Corrections in force"}
        </Text>
        <Button variant="quiet" label={showRetired ? "Hide retired" : "Show retired"} onPress={() => setShowRetired((v) => !v)} testID="toggle-retired" />
      </View>
      {q.isPending ? (
        <Loading label="Loading corrections…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.overrides.length === 0 ? (
        <Empty
          title="The shipped tables apply"
          body={canAct ? "When the group measures or finds a better value (an SDS, a handbook table), add it above with its source." : "A lead adds the group's corrections here, each with its source."}
        />
      ) : (
        <DataTable
          label="The group's reference corrections"
          rows={q.data.overrides}
          columns={columns()}
          rowKey={(o) => o.id}
          initialSort={{ key: "who", direction: "desc" }}
          below={canAct ? (o) => (o.retiredAt ? null : <RetireControl o={o} />) : undefined}
          testID="corrections"
        />
      )}
    </Card>
  );
}

/** Desk › Reference: the group's corrections beside the shipped values; a lead adds and retires them. */
export function ReferenceSection({ group, canAct }: DeskSectionProps) {
  return (
    <View style={styles.section}>
      {canAct ? <AddCorrection userId={group.userId} /> : null}
      <Corrections canAct={canAct} />
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  heading: { flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between", alignItems: "center", gap: space.sm },
  retire: { gap: space.sm, padding: space.sm, borderRadius: radii.md, backgroundColor: colors.paper },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
