import { useLocalSearchParams, useRouter } from "expo-router";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useQueryClient } from "@tanstack/react-query";
import type { InvitationPreview } from "../../knowledge/contracts/invitations";
import { ApiError } from "../../hooks/api";
import { authClient } from "../../hooks/auth-client";
import { space } from "../../hooks/theme";
import { useAcceptInvitationMutation, useInvitationPreviewQuery } from "../../hooks/use-invitations";
import { Button } from "../ui/button";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { AuthFrame } from "./auth-frame";

const ROLE_WORDS: Record<string, string> = { owner: "an owner", lead: "a lead", chemist: "a chemist" };

/** Create an account with the invited address, or sign in with it. */
function SignUpOrIn({ invitation, onReady }: { invitation: InvitationPreview; onReady: () => void }) {
  const qc = useQueryClient();
  const [mode, setMode] = useState<"new" | "existing">("new");
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    const next: Record<string, string> = {};
    if (mode === "new" && name.trim().length < 2) next.name = "Tell us your name.";
    if (password.length < 8) next.password = "Use at least 8 characters.";
    setErrors(next);
    if (Object.keys(next).length) return;
    setBusy(true);
    const { error } =
      mode === "new"
        ? await authClient.signUp.email({ name: name.trim(), email: invitation.email, password })
        : await authClient.signIn.email({ email: invitation.email, password });
    setBusy(false);
    if (error) {
      setErrors({
        form:
          mode === "new" && error.status === 422
            ? "An account with this address exists already: sign in instead."
            : mode === "new"
              ? (error.message ?? "That did not work.")
              : "That password does not match this address.",
      });
      return;
    }
    await qc.invalidateQueries();
    onReady();
  };

  return (
    <View style={styles.form}>
      <Chips
        label="Account"
        options={[
          { value: "new", label: "I am new here" },
          { value: "existing", label: "I have an account" },
        ]}
        selected={mode}
        onSelect={setMode}
        testID="invite-mode"
      />
      <Field label="E-mail" value={invitation.email} editable={false} help="The invitation is for this address." testID="invite-account-email" />
      {mode === "new" ? <Field label="Your name" value={name} onChangeText={setName} autoComplete="name" error={errors.name} testID="invite-name" /> : null}
      <Field
        label="Password"
        value={password}
        onChangeText={setPassword}
        secureTextEntry
        autoComplete={mode === "new" ? "new-password" : "current-password"}
        help={mode === "new" ? "At least 8 characters." : undefined}
        onSubmitEditing={submit}
        error={errors.password}
        testID="invite-password"
      />
      {errors.form ? <Notice tone="danger">{errors.form}</Notice> : null}
      <Button label={mode === "new" ? "Create account and join" : "Sign in and join"} onPress={submit} busy={busy} testID="invite-account-submit" />
    </View>
  );
}

/** The page an invitation mail links to: see the invitation, sign up or in, and join the group. */
export function InviteScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const router = useRouter();
  const preview = useInvitationPreviewQuery(String(id));
  const session = authClient.useSession();
  const accept = useAcceptInvitationMutation(String(id));

  if (preview.isPending || session.isPending) return <AuthFrame title="Invitation"><Loading /></AuthFrame>;
  if (preview.isError) {
    const missing = preview.error instanceof ApiError && preview.error.status === 404;
    return (
      <AuthFrame title="Invitation">
        {missing ? <Notice tone="caution">This invitation does not exist. Check the link, or ask for a new invitation.</Notice> : <ErrorState error={preview.error} onRetry={() => preview.refetch()} />}
      </AuthFrame>
    );
  }
  const inv = preview.data;
  const join = () => accept.mutate(undefined, { onSuccess: () => router.replace("/") });
  const signedInAs = session.data?.user.email;
  const matches = signedInAs?.toLowerCase() === inv.email.toLowerCase();
  const acceptError = accept.error instanceof ApiError ? accept.error.message : accept.error ? "That did not work; try again." : null;

  let body: React.ReactNode;
  if (inv.status !== "pending") {
    body = (
      <Notice tone="caution" testID="invite-closed">
        {inv.status === "accepted" ? "This invitation was used already. Sign in to reach the group." : "This invitation was revoked. Ask the group's lead for a new one."}
      </Notice>
    );
  } else if (inv.expired) {
    body = <Notice tone="caution">This invitation has expired. Ask the group&apos;s lead for a new one.</Notice>;
  } else if (!signedInAs) {
    body = <SignUpOrIn invitation={inv} onReady={join} />;
  } else if (!matches) {
    body = (
      <View style={styles.form}>
        <Notice tone="caution" testID="invite-wrong-account">
          You are signed in as {signedInAs}; this invitation is for {inv.email}. Sign out, then open the link again.
        </Notice>
        <Button variant="secondary" label="Sign out" onPress={() => authClient.signOut()} />
      </View>
    );
  } else {
    body = <Button label={`Join ${inv.groupName}`} onPress={join} busy={accept.isPending} testID="invite-accept" />;
  }

  return (
    <AuthFrame title={`Join ${inv.groupName}`}>
      <Text testID="invite-summary">
        {inv.inviterName} invites {inv.email} to join {inv.groupName} as {ROLE_WORDS[inv.role] ?? inv.role}.
      </Text>
      {body}
      {acceptError ? <Notice tone="danger">{acceptError}</Notice> : null}
    </AuthFrame>
  );
}

const styles = StyleSheet.create({ form: { gap: space.lg } });
