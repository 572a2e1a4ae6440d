import { Link, useGlobalSearchParams, useRouter } from "expo-router";
import { safeReturnTo } from "./return-to";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useQueryClient } from "@tanstack/react-query";
import { authClient } from "../../hooks/auth-client";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";

/** E-mail and password sign-in. Keeps what was typed when it fails. */
export function SignInForm({ onSignedIn }: { onSignedIn?: () => void }) {
  const router = useRouter();
  const { next } = useGlobalSearchParams<{ next?: string }>();
  const qc = useQueryClient();
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    if (!email.trim() || !password) {
      setError("Enter your e-mail and password.");
      return;
    }
    setBusy(true);
    setError(null);
    const { error: failed } = await authClient.signIn.email({ email: email.trim(), password });
    setBusy(false);
    if (failed) {
      setError(failed.status === 429 ? "Too many attempts. Wait a minute, then try again." : "That e-mail and password do not match.");
      return;
    }
    await qc.invalidateQueries();
    if (onSignedIn) onSignedIn();
    else if (router.canDismiss()) router.dismissTo(safeReturnTo(next) as never);
    else router.replace(safeReturnTo(next) as never);
  };

  return (
    <View style={styles.form}>
      <Field
        label="E-mail"
        value={email}
        onChangeText={setEmail}
        autoCapitalize="none"
        autoComplete="email"
        keyboardType="email-address"
        inputMode="email"
        testID="sign-in-email"
      />
      <Field
        label="Password"
        value={password}
        onChangeText={setPassword}
        secureTextEntry
        autoComplete="current-password"
        onSubmitEditing={submit}
        testID="sign-in-password"
      />
      {error ? (
        <Notice tone="danger" testID="sign-in-error">
          {error}
        </Notice>
      ) : null}
      <Button label="Sign in" onPress={submit} busy={busy} testID="sign-in-submit" />
      <Link href="/forgot-password" testID="forgot-password-link">
        <Text bold tone="brand">
          Forgot password?
        </Text>
      </Link>
      <Text tone="inkMuted">
        New here?{" "}
        <Link href="/sign-up">
          <Text bold tone="brand">
            Create an account
          </Text>
        </Link>
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
