import { Link, useLocalSearchParams } from "expo-router";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { authClient } from "../../hooks/auth-client";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";

/** The page the reset mail links to: choose a new password with the link's token. */
export function ResetPasswordForm() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  const [password, setPassword] = useState("");
  const [again, setAgain] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  if (!token) {
    return (
      <View style={styles.form}>
        <Notice tone="caution" title="This link is incomplete">
          Open the link from the reset mail as it is, or ask for a new one.
        </Notice>
        <Link href="/forgot-password">
          <Text bold tone="brand">
            Ask for a new link
          </Text>
        </Link>
      </View>
    );
  }

  const submit = async () => {
    const next: Record<string, string> = {};
    if (password.length < 8) next.password = "Use at least 8 characters.";
    else if (again !== password) next.again = "The two passwords differ.";
    setErrors(next);
    if (Object.keys(next).length) return;
    setBusy(true);
    const { error } = await authClient.resetPassword({ newPassword: password, token: String(token) });
    setBusy(false);
    if (error) {
      setErrors({ form: "This link has expired or was already used. Ask for a new one." });
      return;
    }
    setDone(true);
  };

  if (done) {
    return (
      <View style={styles.form}>
        <Notice tone="good" title="Password changed" testID="reset-done">
          Sign in with your new password.
        </Notice>
        <Link href="/sign-in">
          <Text bold tone="brand">
            Sign in
          </Text>
        </Link>
      </View>
    );
  }

  return (
    <View style={styles.form}>
      <Field
        label="New password"
        value={password}
        onChangeText={setPassword}
        secureTextEntry
        autoComplete="new-password"
        help="At least 8 characters."
        error={errors.password}
        testID="reset-password"
      />
      <Field
        label="New password again"
        value={again}
        onChangeText={setAgain}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
        error={errors.again}
        testID="reset-password-again"
      />
      {errors.form ? (
        <Notice tone="danger">
          <Text>{errors.form}</Text>
          <Link href="/forgot-password">
            <Text bold tone="brand">
              Ask for a new link
            </Text>
          </Link>
        </Notice>
      ) : null}
      <Button label="Set new password" onPress={submit} busy={busy} testID="reset-submit" />
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
