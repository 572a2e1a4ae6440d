import { Link } from "expo-router";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { authClient } from "../../hooks/auth-client";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";

/** Asks for a reset link by e-mail. Says the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const [email, setEmail] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    if (!/^\S+@\S+\.\S+$/.test(email.trim())) {
      setError("Enter the e-mail address you sign in with.");
      return;
    }
    setBusy(true);
    setError(null);
    const { error: failed } = await authClient.requestPasswordReset({ email: email.trim(), redirectTo: "/reset-password" });
    setBusy(false);
    if (failed) {
      setError(failed.status === 429 ? "Too many requests. Wait a minute, then try again." : (failed.message ?? "That did not work; try again."));
      return;
    }
    setSentTo(email.trim());
  };

  return (
    <View style={styles.form}>
      {sentTo ? (
        <Notice tone="good" title="Check your mail" testID="forgot-sent">
          If {sentTo} has a Phasewise account, a link to choose a new password is on its way. It works for one hour.
        </Notice>
      ) : (
        <>
          <Text tone="inkMuted">We will mail you a link to choose a new password.</Text>
          <Field
            label="E-mail"
            value={email}
            onChangeText={setEmail}
            autoCapitalize="none"
            autoComplete="email"
            inputMode="email"
            onSubmitEditing={submit}
            error={error ?? undefined}
            testID="forgot-email"
          />
          <Button label="Send the link" onPress={submit} busy={busy} testID="forgot-submit" />
        </>
      )}
      <Link href="/sign-in">
        <Text bold tone="brand">
          Back to sign-in
        </Text>
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
