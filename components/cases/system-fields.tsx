import { StyleSheet, View } from "react-native";
import { colors, space } from "../../hooks/theme";
import { findSolute, findSolvent } from "../../knowledge/reference";
import { concentrationPicks, VOLUME_PICKS } from "../layers/system-form";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { QuantityField } from "../ui/quantity-field";
import { SolutePicker } from "../ui/solute-picker";
import { SolventPicker } from "../ui/solvent-picker";
import { Text } from "../ui/text";
import type { CaseDraftValue, FieldErrors } from "./case-draft";

type SetDraft = (fn: (d: CaseDraftValue) => CaseDraftValue) => void;

const TEMPERATURE_PICKS = ["5 °C", "20 °C", "25 °C", "40 °C"] as const;

/**
 * A name is picked from the reference tables (any synonym finds it), or typed freely when the
 * tables do not have it: the case log keeps unusual solvents too, just without a prediction.
 */
function isFree(text: string, flagged: boolean | undefined, known: (t: string) => unknown): boolean {
  return !!flagged || (text.trim() !== "" && !known(text));
}

function FreeName({
  label,
  value,
  onChange,
  onBack,
  error,
  testID,
}: {
  label: string;
  value: string;
  onChange: (t: string) => void;
  onBack: () => void;
  error?: string;
  testID: string;
}) {
  return (
    <View style={styles.free}>
      <Field
        label={label}
        value={value}
        onChangeText={onChange}
        autoCapitalize="none"
        autoCorrect={false}
        error={error}
        help="Not in the reference tables: saved as typed, no layer prediction"
        testID={`${testID}-free`}
      />
      <View style={styles.start}>
        <Button label="Pick from the tables instead" variant="quiet" onPress={onBack} testID={`${testID}-pick-instead`} />
      </View>
    </View>
  );
}

export function SystemFields({ draft, set, errors }: { draft: CaseDraftValue; set: SetDraft; errors: FieldErrors }) {
  const setOrganic = (i: number, patch: Partial<CaseDraftValue["organic"][number]>) =>
    set((d) => ({ ...d, organic: d.organic.map((o, j) => (j === i ? { ...o, ...patch } : o)) }));
  const setAqueous = (patch: Partial<CaseDraftValue["aqueous"]>) => set((d) => ({ ...d, aqueous: { ...d.aqueous, ...patch } }));
  const several = draft.organic.length > 1;
  const solute = findSolute(draft.aqueous.solute);
  const soluteFree = isFree(draft.aqueous.solute, draft.aqueous.freeText, findSolute);
  return (
    <View style={styles.section}>
      <Text size="title" bold accessibilityRole="header">
        Organic phase
      </Text>
      {draft.organic.map((o, i) => {
        const label = several ? `Solvent ${i + 1}` : "Solvent";
        return (
          <View key={i} style={styles.part}>
            {isFree(o.solvent, o.freeText, findSolvent) ? (
              <FreeName
                label={label}
                value={o.solvent}
                onChange={(t) => setOrganic(i, { solvent: t, freeText: true })}
                onBack={() => setOrganic(i, { solvent: "", freeText: false })}
                error={errors[`system.organic.${i}.solvent`]}
                testID={`organic-${i}-solvent`}
              />
            ) : (
              <>
                <SolventPicker
                  label={label}
                  value={findSolvent(o.solvent)?.key ?? null}
                  onChange={(key) => setOrganic(i, { solvent: key, freeText: false })}
                  error={errors[`system.organic.${i}.solvent`]}
                  testID={`organic-${i}-solvent`}
                />
                {!o.solvent ? (
                  <View style={styles.start}>
                    <Button label="Not in the list? Type its name" variant="quiet" onPress={() => setOrganic(i, { freeText: true })} testID={`organic-${i}-solvent-type`} />
                  </View>
                ) : null}
              </>
            )}
            <QuantityField
              label={several ? `Volume of solvent ${i + 1}` : "Volume"}
              kind="volume"
              text={o.volume}
              onChangeText={(t) => setOrganic(i, { volume: t })}
              picks={VOLUME_PICKS}
              placeholder="50 mL"
              error={errors[`system.organic.${i}.volumeMl`]}
              testID={`organic-${i}-volume`}
            />
            {several ? (
              <View style={styles.start}>
                <Button
                  label={`Remove solvent ${i + 1}`}
                  variant="quiet"
                  onPress={() => set((d) => ({ ...d, organic: d.organic.filter((_, j) => j !== i) }))}
                  testID={`organic-${i}-remove`}
                />
              </View>
            ) : null}
          </View>
        );
      })}
      {draft.organic.length < 6 ? (
        <Button
          label="Add another solvent"
          variant="secondary"
          onPress={() => set((d) => ({ ...d, organic: [...d.organic, { solvent: "", volume: "" }] }))}
          testID="organic-add"
        />
      ) : null}

      <Text size="title" bold accessibilityRole="header">
        Aqueous phase
      </Text>
      {soluteFree ? (
        <FreeName
          label="Aqueous solution"
          value={draft.aqueous.solute}
          onChange={(t) => setAqueous({ solute: t, freeText: true })}
          onBack={() => setAqueous({ solute: "", freeText: false })}
          error={errors["system.aqueous.solute"]}
          testID="aqueous-solute"
        />
      ) : (
        <>
          <SolutePicker
            label="Aqueous solution"
            value={solute?.key ?? null}
            onChange={(key, concentration) =>
              setAqueous({
                solute: key,
                freeText: false,
                concentration: key === "water" ? "" : (concentration ?? (key === solute?.key ? draft.aqueous.concentration : "")),
              })
            }
            error={errors["system.aqueous.solute"]}
            testID="aqueous-solute"
          />
          {!draft.aqueous.solute ? (
            <View style={styles.start}>
              <Button label="Not in the list? Type its name" variant="quiet" onPress={() => setAqueous({ freeText: true })} testID="aqueous-solute-type" />
            </View>
          ) : null}
        </>
      )}
      {solute?.key !== "water" ? (
        <QuantityField
          label="Concentration"
          kind="concentration"
          text={draft.aqueous.concentration}
          onChangeText={(t) => setAqueous({ concentration: t })}
          picks={solute ? concentrationPicks(solute) : ["saturated", "1 M", "10 %"]}
          placeholder="e.g. 1 M or saturated"
          error={errors["system.aqueous.concentration"] ?? errors["system.aqueous.concentration.value"]}
          testID="aqueous-concentration"
        />
      ) : null}
      <QuantityField
        label="Volume"
        kind="volume"
        text={draft.aqueous.volume}
        onChangeText={(t) => setAqueous({ volume: t })}
        picks={VOLUME_PICKS}
        placeholder="50 mL"
        error={errors["system.aqueous.volumeMl"]}
        testID="aqueous-volume"
      />
      <QuantityField
        label="Temperature in the funnel"
        kind="temperature"
        text={draft.temperature}
        onChangeText={(t) => set((d) => ({ ...d, temperature: t }))}
        picks={TEMPERATURE_PICKS}
        error={errors["system.temperatureC"]}
        testID="temperature"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  part: { gap: space.sm, paddingLeft: space.md, borderLeftWidth: 4, borderLeftColor: colors.organic },
  free: { gap: space.xs },
  start: { alignSelf: "flex-start", marginLeft: -space.lg },
});
