import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import {
  useActivateGroupMutation,
  useActiveGroup,
  useChangeRoleMutation,
  useCreateGroupMutation,
  useMeQuery,
  useMembersQuery,
  useRemoveMemberMutation,
  type GroupMember,
  type GroupRole,
} from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";

const ROLE_LABEL: Record<GroupRole, string> = { owner: "Owner", lead: "Lead", chemist: "Chemist" };

function MemberRow({ m, groupId, canManage, isSelf }: { m: GroupMember; groupId: string; canManage: boolean; isSelf: boolean }) {
  const change = useChangeRoleMutation(groupId);
  const remove = useRemoveMemberMutation(groupId);
  const error = (change.error ?? remove.error) as ApiError | null;
  const target: GroupRole = m.role === "lead" ? "chemist" : "lead";
  return (
    <View style={styles.member} testID={`member-${m.email}`}>
      <View style={styles.memberText}>
        <Text bold>
          {m.name}
          {isSelf ? " (you)" : ""}
        </Text>
        <Text size="caption" tone="inkMuted">
          {m.email}
        </Text>
      </View>
      <View style={[styles.rolePill, m.role === "owner" && styles.ownerPill]}>
        <Text size="caption" bold tone="brand">
          {ROLE_LABEL[m.role]}
        </Text>
      </View>
      {canManage && m.role !== "owner" ? (
        <View style={styles.memberActions}>
          <Button
            variant="secondary"
            label={`Make ${ROLE_LABEL[target].toLowerCase()}`}
            busy={change.isPending}
            onPress={() => change.mutate({ memberId: m.id, role: target })}
          />
          <Button variant="danger" label="Remove" busy={remove.isPending} onPress={() => remove.mutate(m.id)} />
        </View>
      ) : null}
      {error ? <Text tone="danger">{error.message}</Text> : null}
    </View>
  );
}

function Members({ groupId, userId }: { groupId: string; userId: string }) {
  const q = useMembersQuery(groupId);
  if (q.isPending) return <Loading label="Loading members…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const canManage = q.data.yourRole === "owner";
  return (
    <Card>
      <Text size="title" bold>
        Members
      </Text>
      <Text tone="inkMuted">
        {canManage ? "As owner you can switch members between lead and chemist, or remove them." : "Only an owner changes roles."}
      </Text>
      {q.data.members.map((m) => (
        <MemberRow key={m.id} m={m} groupId={groupId} canManage={canManage} isSelf={m.userId === userId} />
      ))}
    </Card>
  );
}

function CreateGroup() {
  const [name, setName] = useState("");
  const create = useCreateGroupMutation();
  const err = create.error as ApiError | null;
  return (
    <Card>
      <Text size="title" bold>
        Start a lab group
      </Text>
      <Field label="Group name" value={name} onChangeText={setName} error={err?.fields?.name ?? err?.message} testID="group-name" />
      <Button
        label="Create group"
        busy={create.isPending}
        onPress={() => create.mutate(name, { onSuccess: () => setName("") })}
        testID="group-create"
      />
    </Card>
  );
}

export function GroupScreen() {
  const me = useMeQuery();
  const active = useActiveGroup();
  const activate = useActivateGroupMutation();
  if (me.isPending) return <Screen title="Group"><Loading /></Screen>;
  if (me.isError) return <Screen title="Group"><ErrorState error={me.error} onRetry={() => me.refetch()} /></Screen>;
  const groups = me.data.groups;
  return (
    <Screen title="Group" subtitle={active ? `${active.name} · you are ${ROLE_LABEL[active.role].toLowerCase()}` : undefined}>
      {groups.length === 0 ? (
        <Empty title="No group yet" body="A lab group holds your shared cases, plans and corrections. Start one, or ask a lead to invite you." />
      ) : null}
      {groups.length > 1 ? (
        <Card>
          <Text size="title" bold>
            Your groups
          </Text>
          {groups.map((g) => (
            <View key={g.id} style={styles.groupRow}>
              <View style={styles.memberText}>
                <Text bold>{g.name}</Text>
                <Text size="caption" tone="inkMuted">
                  {ROLE_LABEL[g.role]}
                </Text>
              </View>
              {g.id === active?.id ? (
                <Text bold tone="good">
                  Active
                </Text>
              ) : (
                <Button variant="secondary" label={`Switch to ${g.name}`} busy={activate.isPending} onPress={() => activate.mutate(g.id)} />
              )}
            </View>
          ))}
        </Card>
      ) : null}
      {active ? <Members groupId={active.id} userId={active.userId} /> : null}
      <CreateGroup />
      {activate.isError ? <Notice tone="danger">{(activate.error as Error).message}</Notice> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  member: {
    flexDirection: "row",
    flexWrap: "wrap",
    alignItems: "center",
    gap: space.md,
    paddingVertical: space.md,
    borderTopWidth: 1,
    borderTopColor: colors.line,
  },
  memberText: { flexGrow: 1, flexShrink: 1, minWidth: 160 },
  memberActions: { flexDirection: "row", gap: space.sm, flexWrap: "wrap" },
  rolePill: { paddingHorizontal: space.md, paddingVertical: space.xs, borderRadius: radii.pill, backgroundColor: colors.infoSoft },
  ownerPill: { backgroundColor: colors.organicSoft },
  groupRow: { flexDirection: "row", alignItems: "center", flexWrap: "wrap", gap: space.md },
});
