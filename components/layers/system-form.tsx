import { StyleSheet, View } from "react-native";
import { maxMassFractionPct, molarityFromMassFraction } from "../../knowledge/concentration";
import { MAX_ORGANIC_PARTS } from "../../knowledge/contracts/layers";
import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import type { AqueousSolute, ReferenceData } from "../../knowledge/types";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { QuantityField } from "../ui/quantity-field";
import { SolutePicker } from "../ui/solute-picker";
import { SolventPicker } from "../ui/solvent-picker";
import { Text } from "../ui/text";
import type { FieldErrors, LayerDraft } from "./layer-draft";

/** Common funnel volumes (UX.md): pick instead of typing. */
export const VOLUME_PICKS = ["5 mL", "10 mL", "15 mL", "20 mL", "25 mL", "50 mL", "100 mL"] as const;
const TEMPERATURE_PICKS = ["0 °C", "10 °C", "20 °C", "25 °C", "30 °C", "40 °C"] as const;
const DISSOLVED_PICKS = ["1 g", "2 g", "5 g", "10 g"] as const;
const CONCENTRATION_CANDIDATES = [
  { text: "1 M", molPerL: 1 },
  { text: "2 M", molPerL: 2 },
  { text: "6 M", molPerL: 6 },
  { text: "5 %", pct: 5 },
  { text: "10 %", pct: 10 },
  { text: "25 %", pct: 25 },
  { text: "50 %", pct: 50 },
];

/** Quick picks a solute's table can answer: "saturated" where it has a limit, then molarities and percentages within it. */
export function concentrationPicks(solute: AqueousSolute): string[] {
  const wMax = maxMassFractionPct(solute);
  const cMax = molarityFromMassFraction(solute, wMax);
  const fits = CONCENTRATION_CANDIDATES.filter((c) => (c.molPerL !== undefined ? c.molPerL <= cMax : c.pct! <= wMax)).map((c) => c.text);
  return [...(solute.saturationWtPct ? ["saturated"] : []), ...fits].slice(0, 7);
}

export interface SystemFormProps {
  draft: LayerDraft;
  onChange: (next: LayerDraft) => void;
  errors: FieldErrors;
  reference?: ReferenceData;
}

/** The inputs of a layer check: organic solvent(s) with volumes, the aqueous phase, the temperature. */
export function SystemForm({ draft, onChange, errors, reference = SHIPPED_REFERENCE }: SystemFormProps) {
  const setOrganic = (i: number, patch: Partial<LayerDraft["organic"][number]>) =>
    onChange({ ...draft, organic: draft.organic.map((p, k) => (k === i ? { ...p, ...patch } : p)) });
  const setAqueous = (patch: Partial<LayerDraft["aqueous"]>) => onChange({ ...draft, aqueous: { ...draft.aqueous, ...patch } });
  const solute = reference.solutes.find((s) => s.key === draft.aqueous.solute);
  const several = draft.organic.length > 1;

  return (
    <View style={styles.stack}>
      <Card>
        <Text bold size="title">
          Organic phase
        </Text>
        {draft.organic.map((part, i) => (
          <View key={i} style={[styles.part, several && styles.partSeparated]}>
            <SolventPicker
              label={several ? `Solvent ${i + 1}` : "Solvent"}
              value={part.solvent}
              onChange={(key) => setOrganic(i, { solvent: key })}
              reference={reference}
              error={errors[`organic[${i}].solvent`]}
              testID={`organic-${i}`}
            />
            <QuantityField
              label={several ? `Volume of solvent ${i + 1}` : "Volume"}
              kind="volume"
              text={part.volume}
              onChangeText={(volume) => setOrganic(i, { volume })}
              picks={VOLUME_PICKS}
              error={errors[`organic[${i}].volumeMl`]}
              testID={`organic-${i}-volume`}
            />
            {several ? (
              <Button
                label={`Remove solvent ${i + 1}`}
                variant="quiet"
                onPress={() => onChange({ ...draft, organic: draft.organic.filter((_, k) => k !== i) })}
                testID={`organic-${i}-remove`}
              />
            ) : null}
          </View>
        ))}
        {draft.organic.length < MAX_ORGANIC_PARTS ? (
          <Button
            label="Add a co-solvent"
            variant="secondary"
            onPress={() => onChange({ ...draft, organic: [...draft.organic, { solvent: null, volume: "10 mL" }] })}
            testID="organic-add"
          />
        ) : null}
        <QuantityField
          label="Dissolved product (optional)"
          kind="mass"
          text={draft.dissolved}
          onChangeText={(dissolved) => onChange({ ...draft, dissolved })}
          picks={DISSOLVED_PICKS}
          error={errors.dissolvedSolidsG}
          help="Grams in the organic layer; several grams can change its density."
          placeholder="0 g"
          testID="dissolved"
        />
      </Card>

      <Card>
        <Text bold size="title">
          Aqueous phase
        </Text>
        <SolutePicker
          label="Solution"
          value={draft.aqueous.solute}
          onChange={(key, concentration) =>
            setAqueous({ solute: key, concentration: key === "water" ? "" : (concentration ?? (key === draft.aqueous.solute ? draft.aqueous.concentration : "")) })
          }
          reference={reference}
          error={errors["aqueous.solute"]}
          testID="aqueous"
        />
        {solute && solute.key !== "water" ? (
          <QuantityField
            label="Concentration"
            kind="concentration"
            text={draft.aqueous.concentration}
            onChangeText={(concentration) => setAqueous({ concentration })}
            picks={concentrationPicks(solute)}
            error={errors["aqueous.concentration"] ?? errors["aqueous.concentration.value"]}
            help="Type 3 M, 10 %, 50 g/L or saturated."
            placeholder="e.g. 1 M or saturated"
            testID="aqueous-concentration"
          />
        ) : null}
        <QuantityField
          label="Volume"
          kind="volume"
          text={draft.aqueous.volume}
          onChangeText={(volume) => setAqueous({ volume })}
          picks={VOLUME_PICKS}
          error={errors["aqueous.volumeMl"]}
          testID="aqueous-volume"
        />
      </Card>

      <Card>
        <QuantityField
          label="Temperature in the funnel"
          kind="temperature"
          text={draft.temperature}
          onChangeText={(temperature) => onChange({ ...draft, temperature })}
          picks={TEMPERATURE_PICKS}
          error={errors.temperatureC}
          testID="temperature"
        />
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  part: { gap: space.md },
  partSeparated: { paddingBottom: space.md },
});
