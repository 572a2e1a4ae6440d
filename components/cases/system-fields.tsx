import { StyleSheet, View } from "react-native";
import { colors, space } from "../../hooks/theme";
import { findSolute, findSolvent } from "../../knowledge/reference";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Text } from "../ui/text";
import type { CaseDraftValue, FieldErrors } from "./case-draft";
import { Chip } from "./choice-chips";
import { COMMON_AQUEOUS, COMMON_VOLUMES_ML } from "./vocab";

type SetDraft = (fn: (d: CaseDraftValue) => CaseDraftValue) => void;

/** Quick picks under a volume field: typing stays possible ("0.5 L"), steppers do not exist. */
function VolumePicks({ onPick, testID, current }: { onPick: (ml: number) => void; testID: string; current: string }) {
  return (
    <View style={styles.picks}>
      {COMMON_VOLUMES_ML.map((ml) => (
        <Chip
          key={ml}
          shape="square"
          label={String(ml)}
          on={current.trim() === String(ml) || current.trim() === `${ml} mL`}
          onPress={() => onPick(ml)}
          testID={`${testID}-${ml}`}
        />
      ))}
      <Text size="caption" tone="inkMuted">
        mL
      </Text>
    </View>
  );
}

function solventHelp(text: string): string | undefined {
  if (!text.trim()) return "Any name: DCM, methylene chloride, CH2Cl2 or 75-09-2";
  const s = findSolvent(text);
  return s ? `${s.name} · ${s.densityGPerMl20C.value.toFixed(3)} g/mL at 20 °C` : "Not in the solvent table: saved as typed, no layer prediction";
}

function soluteHelp(text: string): string | undefined {
  if (!text.trim()) return "Water, brine, NaHCO3, 1 M HCl…";
  const s = findSolute(text);
  return s ? s.name : "Not in the aqueous table: saved as typed, no layer prediction";
}

export function SystemFields({ draft, set, errors }: { draft: CaseDraftValue; set: SetDraft; errors: FieldErrors }) {
  const setOrganic = (i: number, patch: Partial<CaseDraftValue["organic"][number]>) =>
    set((d) => ({ ...d, organic: d.organic.map((o, j) => (j === i ? { ...o, ...patch } : o)) }));
  const setAqueous = (patch: Partial<CaseDraftValue["aqueous"]>) => set((d) => ({ ...d, aqueous: { ...d.aqueous, ...patch } }));
  return (
    <View style={styles.section}>
      <Text size="title" bold accessibilityRole="header">
        Organic phase
      </Text>
      {draft.organic.map((o, i) => (
        <View key={i} style={styles.part}>
          <Field
            label={draft.organic.length > 1 ? `Solvent ${i + 1}` : "Solvent"}
            value={o.solvent}
            onChangeText={(t) => setOrganic(i, { solvent: t })}
            autoCapitalize="none"
            autoCorrect={false}
            error={errors[`system.organic.${i}.solvent`]}
            help={solventHelp(o.solvent)}
            testID={`organic-${i}-solvent`}
          />
          <Field
            label="Volume"
            value={o.volume}
            onChangeText={(t) => setOrganic(i, { volume: t })}
            placeholder="50 mL"
            inputMode="decimal"
            error={errors[`system.organic.${i}.volumeMl`]}
            testID={`organic-${i}-volume`}
          />
          <VolumePicks current={o.volume} onPick={(ml) => setOrganic(i, { volume: String(ml) })} testID={`organic-${i}-volume-pick`} />
          {draft.organic.length > 1 ? (
            <Button
              label={`Remove solvent ${i + 1}`}
              variant="quiet"
              onPress={() => set((d) => ({ ...d, organic: d.organic.filter((_, j) => j !== i) }))}
              testID={`organic-${i}-remove`}
            />
          ) : null}
        </View>
      ))}
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
      <View style={styles.picks}>
        {COMMON_AQUEOUS.map((a) => (
          <Chip
            key={a.label}
            shape="square"
            label={a.label}
            on={draft.aqueous.solute === a.solute && draft.aqueous.concentration === a.concentration}
            onPress={() => setAqueous({ solute: a.solute, concentration: a.concentration })}
            testID={`aqueous-pick-${a.solute.replace(/\s+/g, "-")}`}
          />
        ))}
      </View>
      <Field
        label="Aqueous solution"
        value={draft.aqueous.solute}
        onChangeText={(t) => setAqueous({ solute: t })}
        autoCapitalize="none"
        autoCorrect={false}
        error={errors["system.aqueous.solute"]}
        help={soluteHelp(draft.aqueous.solute)}
        testID="aqueous-solute"
      />
      <View style={styles.pair}>
        <View style={styles.pairItem}>
          <Field
            label="Concentration"
            value={draft.aqueous.concentration}
            onChangeText={(t) => setAqueous({ concentration: t })}
            placeholder="sat., 1 M, 10 %"
            autoCapitalize="none"
            error={errors["system.aqueous.concentration"]}
            testID="aqueous-concentration"
          />
        </View>
        <View style={styles.pairItem}>
          <Field
            label="Temperature (°C)"
            value={draft.temperature}
            onChangeText={(t) => set((d) => ({ ...d, temperature: t }))}
            inputMode="decimal"
            error={errors["system.temperatureC"]}
            testID="temperature"
          />
        </View>
      </View>
      <Field
        label="Volume"
        value={draft.aqueous.volume}
        onChangeText={(t) => setAqueous({ volume: t })}
        placeholder="50 mL"
        inputMode="decimal"
        error={errors["system.aqueous.volumeMl"]}
        testID="aqueous-volume"
      />
      <VolumePicks current={draft.aqueous.volume} onPick={(ml) => setAqueous({ volume: String(ml) })} testID="aqueous-volume-pick" />
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md },
  part: { gap: space.sm, paddingLeft: space.md, borderLeftWidth: 4, borderLeftColor: colors.organic },
  picks: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  pair: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  pairItem: { flexGrow: 1, flexBasis: 150 },
});
