import { useState } from "react";
import { StyleSheet, View } from "react-native";
import type { InvitableRole, InvitationView } from "../../knowledge/contracts/invitations";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { useMembersQuery, type GroupRole } from "../../hooks/use-me";
import { useInviteMutation, usePendingInvitationsQuery, useRevokeInvitationMutation } from "../../hooks/use-invitations";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import type { DeskSectionProps } from "./desk-sections";
import { formatDay } from "./format";

const ROLE_LABEL: Record<GroupRole, string> = { owner: "Owner", lead: "Lead", chemist: "Chemist" };
const ROLE_HELP: Record<InvitableRole, string> = {
  chemist: "logs and reads the group's work-ups",
  lead: "also curates cases and reference values",
  owner: "also manages members and roles",
};

function Members({ groupId, userId }: { groupId: string; userId: string }) {
  const q = useMembersQuery(groupId);
  if (q.isPending) return <Loading label="Loading members…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  return (
    <Card>
      <Text size="title" bold>
        Members ({q.data.members.length})
      </Text>
      {q.data.members.map((m) => (
        <View key={m.id} style={styles.row} testID={`desk-member-${m.email}`}>
          <View style={styles.grow}>
            <Text bold>
              {m.name}
              {m.userId === userId ? " (you)" : ""}
            </Text>
            <Text size="caption" tone="inkMuted">
              {m.email} · joined {formatDay(m.joinedAt)}
            </Text>
          </View>
          <View style={styles.pill}>
            <Text size="caption" bold tone="brand">
              {ROLE_LABEL[m.role]}
            </Text>
          </View>
        </View>
      ))}
      <Text size="caption" tone="inkMuted">
        An owner changes roles or removes members on the Group screen.
      </Text>
    </Card>
  );
}

function InviteForm({ groupId, role }: { groupId: string; role: GroupRole }) {
  const [email, setEmail] = useState("");
  const [invitedRole, setInvitedRole] = useState<InvitableRole>("chemist");
  const invite = useInviteMutation(groupId);
  const err = invite.error instanceof ApiError ? invite.error : null;
  const roles: InvitableRole[] = role === "owner" ? ["chemist", "lead", "owner"] : ["chemist", "lead"];
  const sent = invite.data;
  return (
    <Card>
      <Text size="title" bold>
        Invite by e-mail
      </Text>
      <Field
        label="E-mail address"
        value={email}
        onChangeText={setEmail}
        autoCapitalize="none"
        inputMode="email"
        autoComplete="email"
        error={err?.fields?.email ?? (err && !err.fields?.role ? err.message : undefined)}
        testID="invite-email"
      />
      <Chips
        label="Role"
        showLabel
        options={roles.map((r) => ({ value: r, label: ROLE_LABEL[r] }))}
        selected={invitedRole}
        onSelect={setInvitedRole}
        testID="invite-role"
      />
      <Text size="caption" tone="inkMuted">
        A {ROLE_LABEL[invitedRole].toLowerCase()} {ROLE_HELP[invitedRole]}.
      </Text>
      <Button
        label="Send invitation"
        busy={invite.isPending}
        disabled={!email.trim()}
        onPress={() => invite.mutate({ email: email.trim(), role: invitedRole }, { onSuccess: () => setEmail("") })}
        testID="invite-send"
      />
      {sent ? (
        <Notice tone={sent.mailed ? "good" : "caution"} testID="invite-result">
          {sent.mailed
            ? `Invitation sent to ${sent.email}; the link works until ${formatDay(sent.expiresAt)}.`
            : `The invitation to ${sent.email} is saved but the mail did not go out. Send it again in a moment.`}
        </Notice>
      ) : null}
    </Card>
  );
}

function PendingRow({ inv, groupId }: { inv: InvitationView; groupId: string }) {
  const revoke = useRevokeInvitationMutation(groupId);
  return (
    <View style={styles.row} testID={`pending-${inv.email}`}>
      <View style={styles.grow}>
        <Text bold>{inv.email}</Text>
        <Text size="caption" tone="inkMuted">
          {ROLE_LABEL[(inv.role as GroupRole) ?? "chemist"] ?? inv.role} · invited by {inv.invitedBy?.name ?? "someone"} on {formatDay(inv.createdAt)} · valid until{" "}
          {formatDay(inv.expiresAt)}
        </Text>
        {revoke.error ? <Text tone="danger">{(revoke.error as Error).message}</Text> : null}
      </View>
      <Button variant="danger" label="Revoke" busy={revoke.isPending} onPress={() => revoke.mutate(inv.id)} testID={`revoke-${inv.email}`} />
    </View>
  );
}

function Pending({ groupId }: { groupId: string }) {
  const q = usePendingInvitationsQuery(groupId);
  return (
    <Card>
      <Text size="title" bold>
        Pending invitations
      </Text>
      {q.isPending ? (
        <Loading label="Loading invitations…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.invitations.length === 0 ? (
        <Empty title="No pending invitations" body="Invitations you send wait here until they are accepted, revoked or expire." />
      ) : (
        q.data.invitations.map((inv) => <PendingRow key={inv.id} inv={inv} groupId={groupId} />)
      )}
    </Card>
  );
}

/** Desk › People: members with roles; a lead or owner invites and revokes. */
export function PeopleSection({ group, canAct }: DeskSectionProps) {
  return (
    <View style={styles.section}>
      <Members groupId={group.id} userId={group.userId} />
      {canAct ? (
        <>
          <InviteForm groupId={group.id} role={group.role} />
          <Pending groupId={group.id} />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  row: {
    flexDirection: "row",
    flexWrap: "wrap",
    alignItems: "center",
    gap: space.md,
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  grow: { flexGrow: 1, flexShrink: 1, minWidth: 200, gap: 2 },
  pill: { borderRadius: radii.pill, borderWidth: 1, borderColor: colors.brand, paddingHorizontal: space.md, paddingVertical: space.xs },
});
