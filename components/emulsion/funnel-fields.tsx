import { StyleSheet, View } from "react-native";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { QuantityField } from "../ui/quantity-field";
import { SolutePicker } from "../ui/solute-picker";
import { SolventPicker } from "../ui/solvent-picker";
import { Text } from "../ui/text";
import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import { VOLUME_PICKS, concentrationPicks } from "../layers/system-form";
import type { EmulsionAnswers } from "./answers";

const TEMPERATURE_PICKS = ["0 °C", "20 °C", "25 °C", "35 °C"] as const;
const MAX_ORGANIC = 4;

export interface StartOption {
  id: string;
  label: string;
}

interface Props {
  answers: EmulsionAnswers;
  onChange: (next: EmulsionAnswers) => void;
  errors: Record<string, string>;
  /** one-line summary of a complete system; null while something is missing */
  summary: string | null;
  editing: boolean;
  onEdit: (editing: boolean) => void;
  starts: StartOption[];
  /** the start the funnel now matches, if any */
  startId: string | null;
  onStart: (id: string) => void;
}

/** The funnel as it is: start from a recent system, or pick the solvents and the wash. */
export function FunnelFields({ answers: a, onChange, errors, summary, editing, onEdit, starts, startId, onStart }: Props) {
  const setOrganic = (i: number, patch: Partial<EmulsionAnswers["organic"][number]>) =>
    onChange({ ...a, organic: a.organic.map((o, j) => (j === i ? { ...o, ...patch } : o)) });
  const setAqueous = (patch: Partial<EmulsionAnswers["aqueous"]>) => onChange({ ...a, aqueous: { ...a.aqueous, ...patch } });
  const solute = SHIPPED_REFERENCE.solutes.find((s) => s.key === a.aqueous.solute);

  return (
    <Card testID="emulsion-funnel">
      <Text bold size="title" accessibilityRole="header">
        Your funnel
      </Text>
      {starts.length > 0 ? (
        <Chips label="Start from a recent system" showLabel scroll options={starts.map((s) => ({ value: s.id, label: s.label }))} selected={startId} onSelect={onStart} testID="emulsion-start" />
      ) : null}
      {summary && !editing ? (
        <View style={styles.summary}>
          <Text bold testID="emulsion-system-summary" style={styles.grow}>
            {summary}
          </Text>
          <Button label="Change" variant="secondary" onPress={() => onEdit(true)} testID="emulsion-system-change" />
        </View>
      ) : (
        <View style={styles.fields}>
          {a.organic.map((o, i) => (
            <View key={i} style={styles.part}>
              <SolventPicker
                label={a.organic.length > 1 ? `Organic solvent ${i + 1}` : "Organic solvent"}
                value={o.solvent}
                onChange={(key) => setOrganic(i, { solvent: key })}
                testID={`emulsion-solvent-${i}`}
              />
              {errors[`system.organic[${i}].solvent`] ? (
                <Text size="caption" tone="danger">
                  {errors[`system.organic[${i}].solvent`]}
                </Text>
              ) : null}
              <QuantityField
                label="Its volume"
                kind="volume"
                text={o.volumeText}
                onChangeText={(t) => setOrganic(i, { volumeText: t })}
                picks={VOLUME_PICKS}
                error={errors[`system.organic[${i}].volumeMl`]}
                testID={`emulsion-organic-volume-${i}`}
              />
              {a.organic.length > 1 ? (
                <Button
                  label={`Remove solvent ${i + 1}`}
                  variant="quiet"
                  onPress={() => onChange({ ...a, organic: a.organic.filter((_, j) => j !== i) })}
                />
              ) : null}
            </View>
          ))}
          {a.organic.length < MAX_ORGANIC ? (
            <Button
              label="Add another organic solvent"
              variant="quiet"
              onPress={() => onChange({ ...a, organic: [...a.organic, { solvent: null, volumeText: "" }] })}
              testID="emulsion-add-solvent"
            />
          ) : null}
          <View style={styles.part}>
            <SolutePicker
              value={a.aqueous.solute}
              onChange={(key, conc) => setAqueous({ solute: key, ...(conc !== undefined ? { concentrationText: conc } : {}) })}
              testID="emulsion-solute"
            />
            {errors["system.aqueous.solute"] ? (
              <Text size="caption" tone="danger">
                {errors["system.aqueous.solute"]}
              </Text>
            ) : null}
            {solute && solute.key !== "water" ? (
              <QuantityField
                label="Its concentration"
                kind="concentration"
                text={a.aqueous.concentrationText}
                onChangeText={(t) => setAqueous({ concentrationText: t })}
                picks={concentrationPicks(solute)}
                error={errors["system.aqueous.concentration"]}
                testID="emulsion-concentration"
              />
            ) : null}
            <QuantityField
              label="Aqueous volume"
              kind="volume"
              text={a.aqueous.volumeText}
              onChangeText={(t) => setAqueous({ volumeText: t })}
              picks={VOLUME_PICKS}
              error={errors["system.aqueous.volumeMl"]}
              testID="emulsion-aqueous-volume"
            />
          </View>
          <QuantityField
            label="Temperature"
            kind="temperature"
            text={a.temperatureText}
            onChangeText={(t) => onChange({ ...a, temperatureText: t })}
            picks={TEMPERATURE_PICKS}
            error={errors["system.temperatureC"]}
            testID="emulsion-temperature"
          />
          {summary ? <Button label="Done" variant="secondary" onPress={() => onEdit(false)} testID="emulsion-system-done" /> : null}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
  part: { gap: space.sm },
  summary: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.md },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 200 },
});
