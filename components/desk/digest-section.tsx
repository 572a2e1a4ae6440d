import { Link } from "expo-router";
import { StyleSheet, View } from "react-native";
import { space } from "../../hooks/theme";
import { useDigestQuery, useSendDigestMutation } from "../../hooks/use-digest";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import type { DeskSectionProps } from "./desk-sections";
import { formatDay } from "./format";

/** Desk › Digest: what this week's mail to leads holds, and a button to send it now. */
export function DigestSection({ group, canAct }: DeskSectionProps) {
  const q = useDigestQuery(group.id, canAct);
  const send = useSendDigestMutation(group.id);
  if (!canAct) {
    return <Text tone="inkMuted">The weekly digest goes to the group&apos;s leads and owners: stubborn open cases and newly verified fixes.</Text>;
  }
  if (q.isPending) return <Loading label="Gathering the week…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const d = q.data;
  return (
    <View style={styles.section}>
      <Card>
        <Text size="title" bold>
          Stubborn open cases ({d.stubborn.length})
        </Text>
        <Text size="caption" tone="inkMuted">
          Open more than 3 days, or 3 or more attempts with no change or worse.
        </Text>
        {d.stubborn.length === 0 ? <Text>Nothing is stuck.</Text> : null}
        {d.stubborn.map((c) => (
          <Link key={c.id} href={`/cases/${c.id}` as never}>
            <Text tone="brand" bold>
              {c.title}
            </Text>
            <Text tone="inkMuted">
              {" "}
              — open {c.openDays} day{c.openDays === 1 ? "" : "s"}, {c.failedAttempts} failed
            </Text>
          </Link>
        ))}
      </Card>
      <Card>
        <Text size="title" bold>
          Newly verified fixes ({d.verified.length})
        </Text>
        <Text size="caption" tone="inkMuted">
          Since {formatDay(d.since)}.
        </Text>
        {d.verified.length === 0 ? <Text>None this week.</Text> : null}
        {d.verified.map((f) => (
          <Link key={f.id} href={`/cases/${f.id}` as never}>
            <Text tone="brand" bold>
              {f.title}
            </Text>
            <Text tone="inkMuted"> — {f.fix}</Text>
          </Link>
        ))}
      </Card>
      <Card>
        <Text>Goes to {d.recipients.length ? d.recipients.join(", ") : "no one yet (the group has no lead)"}.</Text>
        <Button label="Send the digest now" busy={send.isPending} disabled={d.recipients.length === 0} onPress={() => send.mutate()} testID="digest-send" />
        {send.data ? <Notice tone="good">Sent to {send.data.sent} lead{send.data.sent === 1 ? "" : "s"}.</Notice> : null}
        {send.error ? <Notice tone="danger">{(send.error as Error).message}</Notice> : null}
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({ section: { gap: space.lg } });
