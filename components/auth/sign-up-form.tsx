import { Link, useRouter } from "expo-router";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useQueryClient } from "@tanstack/react-query";
import { authClient } from "../../hooks/auth-client";
import { space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";

export function SignUpForm() {
  const router = useRouter();
  const qc = useQueryClient();
  const [name, setName] = useState("");
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    const next: Record<string, string> = {};
    if (name.trim().length < 2) next.name = "Tell us your name.";
    if (!/^\S+@\S+\.\S+$/.test(email.trim())) next.email = "Enter an e-mail address.";
    if (password.length < 8) next.password = "Use at least 8 characters.";
    setErrors(next);
    if (Object.keys(next).length) return;
    setBusy(true);
    const { error } = await authClient.signUp.email({ name: name.trim(), email: email.trim(), password });
    setBusy(false);
    if (error) {
      setErrors({ form: error.message ?? "That did not work." });
      return;
    }
    await qc.invalidateQueries();
    if (router.canDismiss()) router.dismissTo("/group");
    else router.replace("/group");
  };

  return (
    <View style={styles.form}>
      <Field label="Your name" value={name} onChangeText={setName} error={errors.name} autoComplete="name" testID="sign-up-name" />
      <Field
        label="E-mail"
        value={email}
        onChangeText={setEmail}
        error={errors.email}
        autoCapitalize="none"
        inputMode="email"
        autoComplete="email"
        testID="sign-up-email"
      />
      <Field
        label="Password"
        value={password}
        onChangeText={setPassword}
        error={errors.password}
        secureTextEntry
        autoComplete="new-password"
        help="At least 8 characters."
        testID="sign-up-password"
      />
      {errors.form ? <Notice tone="danger">{errors.form}</Notice> : null}
      <Button label="Create account" onPress={submit} busy={busy} testID="sign-up-submit" />
      <Text tone="inkMuted">
        Have an account?{" "}
        <Link href="/sign-in">
          <Text bold tone="brand">
            Sign in
          </Text>
        </Link>
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
