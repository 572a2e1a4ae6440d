import { Link } from "expo-router";
import { Linking, StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import { space } from "../../hooks/theme";
import { useClearOutboxMutation, useOutboxQuery, type OutboxMessage } from "../../hooks/use-outbox";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";

function sameOriginPath(link: string): string | null {
  if (typeof window === "undefined" || !window.location) return null;
  try {
    const u = new URL(link);
    return u.origin === window.location.origin ? `${u.pathname}${u.search}` : null;
  } catch {
    return null;
  }
}

function MessageCard({ m }: { m: OutboxMessage }) {
  return (
    <Card testID="outbox-message">
      <Text bold>{m.subject}</Text>
      <Text size="caption" tone="inkMuted">
        To {m.to.join(", ")} · {new Date(m.receivedAt).toLocaleString()}
      </Text>
      <Text numberOfLines={12}>{m.text}</Text>
      {m.links.length ? (
        <View style={styles.links}>
          {m.links.map((link) => {
            const local = sameOriginPath(link);
            return local ? (
              <Link key={link} href={local as never} testID="outbox-link">
                <Text bold tone="brand">
                  {local}
                </Text>
              </Link>
            ) : (
              <Text key={link} bold tone="brand" accessibilityRole="link" onPress={() => Linking.openURL(link)}>
                {link}
              </Text>
            );
          })}
        </View>
      ) : null}
    </Card>
  );
}

/** Development only: the mail the app sent, caught by the local SMTP outbox. */
export function OutboxScreen() {
  const q = useOutboxQuery();
  const clear = useClearOutboxMutation();
  const none = q.error instanceof ApiError && q.error.status === 404;
  return (
    <Screen
      title="Outbox"
      subtitle="Development only: mail caught by the local SMTP outbox instead of being sent."
      actions={
        <>
          <Button variant="secondary" label="Refresh" busy={q.isFetching} onPress={() => q.refetch()} />
          <Button variant="quiet" label="Empty" busy={clear.isPending} onPress={() => clear.mutate()} />
        </>
      }
    >
      {q.isPending ? (
        <Loading label="Reading the outbox…" />
      ) : none ? (
        <Notice tone="info">There is no local outbox here: mail goes to the service named by SMTP_URL, or this is a production server.</Notice>
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.messages.length === 0 ? (
        <Empty title="No mail yet" body="Invitations, password resets, follower mail and digests appear here when the app sends them." />
      ) : (
        q.data.messages.map((m) => <MessageCard key={m.id} m={m} />)
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({ links: { gap: space.sm } });
