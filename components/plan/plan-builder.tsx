import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { colors, radii, space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { QuantityField } from "../ui/quantity-field";
import { SolutePicker } from "../ui/solute-picker";
import { SolventPicker } from "../ui/solvent-picker";
import { Text } from "../ui/text";
import { newComponent, newWash, type ComponentDraft, type ComponentKind, type FieldErrors, type PlanDraft, type WashDraft } from "./plan-draft";
import { pkaEntry, pkaLine, PkaPicker } from "./pka-picker";

/** Common volumes (UX.md): type or pick, never a stepper. */
export const VOLUME_PICKS = ["5 mL", "10 mL", "15 mL", "20 mL", "25 mL", "50 mL", "100 mL"] as const;
const CONCENTRATION_PICKS = ["0.5 M", "1 M", "2 M", "saturated", "10 %"] as const;
const REPEAT_PICKS = ["1", "2", "3", "4", "5"] as const;
const KINDS: { value: ComponentKind; label: string }[] = [
  { value: "acid", label: "Acid" },
  { value: "base", label: "Base" },
  { value: "neutral", label: "Neutral" },
];

export interface BuilderProps {
  draft: PlanDraft;
  set: (next: (d: PlanDraft) => PlanDraft) => void;
  errors: FieldErrors;
}

const replaceAt = <T,>(list: T[], i: number, next: T) => list.map((x, j) => (j === i ? next : x));
const move = <T,>(list: T[], from: number, to: number) => {
  if (to < 0 || to >= list.length) return list;
  const out = [...list];
  const [item] = out.splice(from, 1);
  out.splice(to, 0, item!);
  return out;
};

/** The organic solution, what it holds, and the washes in order. */
export function PlanBuilder({ draft, set, errors }: BuilderProps) {
  const setComponent = (i: number, c: ComponentDraft) => set((d) => ({ ...d, components: replaceAt(d.components, i, c) }));
  const setWash = (i: number, w: WashDraft) => set((d) => ({ ...d, washes: replaceAt(d.washes, i, w) }));
  return (
    <View style={styles.stack}>
      <Card testID="plan-organic">
        <Text bold size="title" accessibilityRole="header">
          Organic solution
        </Text>
        <SolventPicker value={draft.solvent} onChange={(solvent) => set((d) => ({ ...d, solvent }))} error={errors["organic.solvent"]} testID="plan-solvent" />
        <QuantityField
          label="Volume of the organic layer"
          kind="volume"
          text={draft.volume}
          onChangeText={(volume) => set((d) => ({ ...d, volume }))}
          picks={VOLUME_PICKS}
          error={errors["organic.volumeMl"]}
          testID="plan-volume"
        />
        <QuantityField
          label="Temperature at the funnel"
          kind="temperature"
          text={draft.temperature}
          onChangeText={(temperature) => set((d) => ({ ...d, temperature }))}
          error={errors.temperatureC}
          help="Sets the gas volume and the layer densities."
          testID="plan-temperature"
        />
      </Card>

      <Card testID="plan-components">
        <Text bold size="title" accessibilityRole="header">
          In the organic solution
        </Text>
        {draft.components.length === 0 ? (
          <Text tone="inkMuted">Add the product and each acid or base you want to keep or wash out.</Text>
        ) : null}
        {draft.components.map((c, i) => (
          <ComponentEditor
            key={c.id}
            index={i}
            component={c}
            errors={errors}
            onChange={(next) => setComponent(i, next)}
            onRemove={() => set((d) => ({ ...d, components: d.components.filter((x) => x.id !== c.id), recovery: d.recovery.component === c.id ? { ...d.recovery, component: "" } : d.recovery }))}
          />
        ))}
        <Button label="Add a component" variant="secondary" onPress={() => set((d) => ({ ...d, components: [...d.components, newComponent()] }))} testID="plan-add-component" />
      </Card>

      <Card testID="plan-washes">
        <Text bold size="title" accessibilityRole="header">
          Washes, in order
        </Text>
        {draft.washes.length === 0 ? <Text tone="inkMuted">Add each aqueous wash in the order you will use it.</Text> : null}
        {draft.washes.map((w, i) => (
          <WashEditor
            key={w.id}
            index={i}
            count={draft.washes.length}
            wash={w}
            errors={errors}
            onChange={(next) => setWash(i, next)}
            onMove={(to) => set((d) => ({ ...d, washes: move(d.washes, i, to), recovery: { ...d.recovery, wash: "auto" } }))}
            onRemove={() => set((d) => ({ ...d, washes: d.washes.filter((x) => x.id !== w.id), recovery: { ...d.recovery, wash: "auto" } }))}
          />
        ))}
        <Button label="Add a wash" variant="secondary" onPress={() => set((d) => ({ ...d, washes: [...d.washes, newWash()] }))} testID="plan-add-wash" />
      </Card>
    </View>
  );
}

interface ComponentEditorProps {
  index: number;
  component: ComponentDraft;
  errors: FieldErrors;
  onChange: (c: ComponentDraft) => void;
  onRemove: () => void;
}

function ComponentEditor({ index, component: c, errors, onChange, onRemove }: ComponentEditorProps) {
  const [picking, setPicking] = useState(false);
  const f = `components[${index}]`;
  const t = `plan-component-${index}`;
  const from = pkaEntry(c.pKaFrom);
  const ionisable = c.kind !== "neutral";
  return (
    <View style={styles.item} testID={t}>
      <View style={styles.itemHead}>
        <Text bold>Component {index + 1}</Text>
        <Button label="Remove" variant="quiet" hint={`Remove component ${index + 1}`} onPress={onRemove} testID={`${t}-remove`} />
      </View>
      <Field label="Name" value={c.name} onChangeText={(name) => onChange({ ...c, name })} error={errors[`${f}.name`]} placeholder="e.g. amine side product" testID={`${t}-name`} />
      <Chips label="Kind" showLabel options={KINDS} selected={c.kind} onSelect={(kind) => onChange({ ...c, kind })} testID={`${t}-kind`} />
      {ionisable ? (
        <View style={styles.sub}>
          <Field
            label={c.kind === "base" ? "pKa of the conjugate acid" : "pKa"}
            value={c.pKa}
            onChangeText={(pKa) => onChange({ ...c, pKa, pKaFrom: from && String(from.pKa.value) === pKa.trim() ? c.pKaFrom : undefined })}
            keyboardType="numbers-and-punctuation"
            error={errors[`${f}.pKa`]}
            help={from ? `From the pKa table: ${pkaLine(from)}` : "Type it, or take it from the table."}
            testID={`${t}-pka`}
          />
          {picking ? (
            <PkaPicker
              kind={c.kind as "acid" | "base"}
              onClose={() => setPicking(false)}
              onPick={(e) => {
                onChange({ ...c, pKa: String(e.pKa.value), pKaFrom: e.key, name: c.name.trim() ? c.name : e.name });
                setPicking(false);
              }}
              testID={`${t}-pka-table`}
            />
          ) : (
            <Button label="Pick from the pKa table" variant="secondary" onPress={() => setPicking(true)} testID={`${t}-pka-open`} />
          )}
        </View>
      ) : null}
      <Chips
        label="Partition of the neutral form"
        showLabel
        options={[
          { value: "K", label: "K (this solvent / water)" },
          { value: "logP", label: "log P (octanol / water)" },
        ]}
        selected={c.partitionMode}
        onSelect={(partitionMode) => onChange({ ...c, partitionMode })}
        testID={`${t}-partition-mode`}
      />
      <Field
        label={c.partitionMode === "K" ? "K, organic ÷ aqueous" : "log P"}
        value={c.partition}
        onChangeText={(partition) => onChange({ ...c, partition })}
        keyboardType="numbers-and-punctuation"
        error={errors[`${f}.partitionCoefficient`] ?? errors[`${f}.logP`]}
        help={c.partitionMode === "logP" ? "K is taken as P = 10^logP: a rough estimate, within about a log unit for esters and ethers." : "Measured in this solvent when you have it."}
        testID={`${t}-partition`}
      />
      <View style={styles.row}>
        <View style={styles.grow}>
          <Field
            label={`Amount (${c.amountUnit})`}
            value={c.amount}
            onChangeText={(amount) => onChange({ ...c, amount })}
            keyboardType="decimal-pad"
            error={errors[`${f}.amountMmol`] ?? errors[`${f}.amountG`]}
            testID={`${t}-amount`}
          />
        </View>
        <Chips label="Amount unit" options={["mmol", "g"] as const} selected={c.amountUnit} onSelect={(amountUnit) => onChange({ ...c, amountUnit })} testID={`${t}-unit`} />
      </View>
      {c.amountUnit === "g" ? (
        <Field
          label="Molar mass (g/mol)"
          value={c.molarMass}
          onChangeText={(molarMass) => onChange({ ...c, molarMass })}
          keyboardType="decimal-pad"
          error={errors[`${f}.molarMassGPerMol`]}
          testID={`${t}-molar-mass`}
        />
      ) : null}
    </View>
  );
}

interface WashEditorProps {
  index: number;
  count: number;
  wash: WashDraft;
  errors: FieldErrors;
  onChange: (w: WashDraft) => void;
  onMove: (to: number) => void;
  onRemove: () => void;
}

function WashEditor({ index, count, wash: w, errors, onChange, onMove, onRemove }: WashEditorProps) {
  const f = `washes[${index}]`;
  const t = `plan-wash-${index}`;
  return (
    <View style={styles.item} testID={t}>
      <View style={styles.itemHead}>
        <Text bold>Wash {index + 1}</Text>
        <View style={styles.actions}>
          {index > 0 ? <Button label="Earlier" variant="quiet" hint={`Move wash ${index + 1} up`} onPress={() => onMove(index - 1)} testID={`${t}-up`} /> : null}
          {index < count - 1 ? <Button label="Later" variant="quiet" hint={`Move wash ${index + 1} down`} onPress={() => onMove(index + 1)} testID={`${t}-down`} /> : null}
          <Button label="Remove" variant="quiet" hint={`Remove wash ${index + 1}`} onPress={onRemove} testID={`${t}-remove`} />
        </View>
      </View>
      <SolutePicker
        label="Aqueous solution"
        value={w.solute}
        onChange={(solute, concentration) => onChange({ ...w, solute, ...(concentration !== undefined ? { concentration } : {}) })}
        error={errors[`${f}.aqueous.solute`]}
        testID={`${t}-solute`}
      />
      {w.solute && w.solute !== "water" ? (
        <QuantityField
          label="Concentration"
          kind="concentration"
          text={w.concentration}
          onChangeText={(concentration) => onChange({ ...w, concentration })}
          picks={CONCENTRATION_PICKS}
          error={errors[`${f}.aqueous.concentration`]}
          testID={`${t}-concentration`}
        />
      ) : null}
      <QuantityField label="Volume of each portion" kind="volume" text={w.volume} onChangeText={(volume) => onChange({ ...w, volume })} picks={VOLUME_PICKS} error={errors[`${f}.volumeMl`]} testID={`${t}-volume`} />
      <Chips label="Portions (fresh each time)" showLabel options={REPEAT_PICKS} selected={w.repeats} onSelect={(repeats) => onChange({ ...w, repeats })} testID={`${t}-repeats`} />
      {errors[`${f}.repeats`] ? (
        <Text size="caption" tone="danger">
          {errors[`${f}.repeats`]}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  item: { gap: space.md, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colors.line },
  itemHead: { flexDirection: "row", alignItems: "center", justifyContent: "space-between", flexWrap: "wrap", gap: space.sm },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.xs },
  sub: { gap: space.sm, padding: space.sm, borderRadius: radii.md, borderWidth: 1, borderColor: colors.line },
  row: { flexDirection: "row", alignItems: "flex-end", gap: space.sm, flexWrap: "wrap" },
  grow: { flexGrow: 1, flexBasis: 160 },
});
