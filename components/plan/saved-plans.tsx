import { Link } from "expo-router";
import { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import type { SavedPlanSummary } from "../../knowledge/contracts/plans";
import { colors, radii, space } from "../../hooks/theme";
import { usePlansQuery } from "../../hooks/use-plans";
import { formatDateTime } from "../cases/format";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { solventLabel } from "./plan-format";

const FIRST = 4;

/** The group's saved plans, newest change first; the first few, then all on request. */
export function SavedPlans({ groupName }: { groupName?: string }) {
  const q = usePlansQuery();
  const [all, setAll] = useState(false);
  return (
    <Card testID="plan-saved">
      <Text bold size="title" accessibilityRole="header">
        Saved in {groupName ?? "your group"}
      </Text>
      {q.isPending ? (
        <Loading label="Loading the group's plans…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.plans.length === 0 ? (
        <Text tone="inkMuted">Plans you save appear here for everyone in the group. Build one below and save it.</Text>
      ) : (
        <View style={styles.list} accessibilityRole="list">
          {(all ? q.data.plans : q.data.plans.slice(0, FIRST)).map((p) => (
            <PlanRow key={p.id} plan={p} />
          ))}
          {q.data.plans.length > FIRST ? (
            <Button label={all ? "Show fewer" : `Show all ${q.data.plans.length}`} variant="quiet" onPress={() => setAll(!all)} testID="plan-saved-all" />
          ) : null}
        </View>
      )}
    </Card>
  );
}

function PlanRow({ plan }: { plan: SavedPlanSummary }) {
  const changed = plan.updatedBy ? `changed by ${plan.updatedBy.name}` : `by ${plan.author.name}`;
  return (
    <Link href={`/plan/${plan.id}` as never} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={`${plan.title}, ${solventLabel(plan.solvent)}, ${plan.washCount} washes, ${changed}, ${formatDateTime(plan.updatedAt)}`}
        testID={`plan-saved-${plan.id}`}
        // Link's asChild slot hands style to the DOM as-is: one flat object.
        style={StyleSheet.flatten(styles.row)}
      >
        <Text bold>{plan.title}</Text>
        <Text size="caption" tone="inkMuted">
          {solventLabel(plan.solvent)} · {plan.componentNames.join(", ") || "no components"} · {plan.washCount} wash{plan.washCount === 1 ? "" : "es"}
        </Text>
        <Text size="caption" tone="inkMuted">
          {changed}, {formatDateTime(plan.updatedAt)}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    minHeight: 56,
    padding: space.md,
    gap: 2,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.paper,
  },
});
