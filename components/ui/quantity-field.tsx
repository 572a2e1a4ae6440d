import { StyleSheet, View } from "react-native";
import { space } from "../../hooks/theme";
import { Chips } from "./chips";
import { Field } from "./field";
import { readQuantity, type QuantityFieldKind } from "./quantity";

export { readQuantity, type QuantityFieldKind } from "./quantity";

export interface QuantityFieldProps {
  label: string;
  /** what the user typed, kept as typed ("0.5 L") */
  text: string;
  onChangeText: (text: string) => void;
  /** what the field holds; decides how the text is read */
  kind: QuantityFieldKind;
  /** quick picks as chips under the field; pressing one puts its text in the field */
  picks?: readonly string[];
  /** an error from elsewhere (e.g. "above saturation"); wins over the field's own reading */
  error?: string;
  /** shown when there is nothing better to say */
  help?: string;
  placeholder?: string;
  testID?: string;
}

const same = (a: string, b: string) => a.replace(/\s+/g, "").toLowerCase() === b.replace(/\s+/g, "").toLowerCase();

/**
 * A text field for a quantity with units, forgiving about how it is typed, with quick-pick chips.
 * Under the field it says how the text was read ("Read as 500 mL") or why it could not be.
 * The parent keeps the text and reads it with readQuantity for its own use.
 */
export function QuantityField({ label, text, onChangeText, kind, picks, error, help, placeholder, testID }: QuantityFieldProps) {
  const reading = readQuantity(kind, text);
  const ownError = !reading.ok && !reading.empty ? reading.message : undefined;
  const readAs = reading.ok && !same(reading.display, text) ? `Read as ${reading.display}` : undefined;
  const selected = picks?.find((p) => same(p, text)) ?? null;
  return (
    <View style={styles.wrap}>
      <Field
        label={label}
        value={text}
        onChangeText={onChangeText}
        error={error ?? ownError}
        help={readAs ?? help}
        placeholder={placeholder}
        autoCapitalize="none"
        autoCorrect={false}
        testID={testID}
      />
      {picks && picks.length > 0 ? (
        <Chips label={`${label}: common values`} options={picks} selected={selected} onSelect={onChangeText} testID={testID ? `${testID}-pick` : undefined} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.sm } });
