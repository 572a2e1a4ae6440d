import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import type { CaseDetail } from "../../knowledge/contracts/cases";
import type { CaseRequest } from "../../knowledge/contracts/curation";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { useAnswerRequestMutation, useAskMutation, useCaseRequestsQuery } from "../../hooks/use-curation";
import { useActiveGroup } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { formatDay } from "./format";

/** One request: what the lead asked, the author's reply, and the reply box for the author. */
function RequestItem({ request: r, canAnswer }: { request: CaseRequest; canAnswer: boolean }) {
  const [reply, setReply] = useState("");
  const answer = useAnswerRequestMutation();
  const err = answer.error instanceof ApiError ? answer.error : null;
  return (
    <View style={[styles.item, r.status === "open" && styles.open]} testID={`request-${r.id}`}>
      <Text size="caption" tone="inkMuted">
        {r.askedBy.name} asked {r.askedOf.name} · {formatDay(r.createdAt)} · {r.status === "open" ? "waiting for an answer" : "answered"}
      </Text>
      <Text>{r.text}</Text>
      {r.reply ? (
        <Text>
          <Text bold>Reply: </Text>
          {r.reply}
        </Text>
      ) : null}
      {canAnswer && r.status === "open" ? (
        <View style={styles.form}>
          <Field label="Your answer" value={reply} onChangeText={setReply} multiline error={err?.fields?.reply} testID={`request-reply-${r.id}`} />
          <View style={styles.buttons}>
            <Button
              label="Send the answer"
              disabled={reply.trim() === ""}
              busy={answer.isPending}
              onPress={() => answer.mutate({ id: r.id, reply: reply.trim() })}
              testID={`request-answer-${r.id}`}
            />
            <Button label="Mark as done" variant="quiet" busy={answer.isPending} onPress={() => answer.mutate({ id: r.id, status: "answered" })} />
          </View>
          {err && !err.fields ? <Text tone="danger">{err.message}</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

/**
 * The lead's requests on one case. The case's author (or a lead) answers them here; a lead also
 * asks for more. Shown on the case page and in the review pane.
 */
export function CaseRequests({ caseId, authorId, userId, isLead }: { caseId: string; authorId: string; userId: string; isLead: boolean }) {
  const q = useCaseRequestsQuery(caseId);
  const ask = useAskMutation();
  const [text, setText] = useState("");
  const err = ask.error instanceof ApiError ? ask.error : null;
  const requests = q.data?.requests ?? [];
  if (!isLead && requests.length === 0) return null;
  return (
    <View style={styles.wrap} testID="case-requests">
      <Text bold size="label">
        Requests to the author{requests.length ? ` (${requests.length})` : ""}
      </Text>
      {q.isError ? <Text tone="danger">The requests could not be loaded.</Text> : null}
      {requests.map((r) => (
        <RequestItem key={r.id} request={r} canAnswer={authorId === userId || isLead} />
      ))}
      {isLead ? (
        <View style={styles.form}>
          <Field
            label="Ask the author for more"
            help="A photo, the pH, what happened to the product… The author sees it on this case and in their list."
            value={text}
            onChangeText={setText}
            multiline
            error={err?.fields?.text}
            testID="request-text"
          />
          <Button
            label="Send the request"
            variant="secondary"
            disabled={text.trim().length < 3}
            busy={ask.isPending}
            onPress={() => ask.mutate({ caseId, text: text.trim() }, { onSuccess: () => setText("") })}
            testID="request-send"
          />
          {err && !err.fields ? <Text tone="danger">{err.message}</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  item: { gap: space.xs, padding: space.md, borderRadius: radii.sm, backgroundColor: colors.paper, borderWidth: 1, borderColor: colors.line },
  open: { borderColor: colors.info, backgroundColor: colors.infoSoft },
  form: { gap: space.sm },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});

/**
 * The curation side of a case page: why it is retired (or where it was merged), and the lead's
 * requests to the author with the reply box.
 */
export function CaseCurationNotes({ detail, userId }: { detail: CaseDetail; userId: string }) {
  const group = useActiveGroup();
  const router = useRouter();
  const isLead = group ? group.role === "lead" || group.role === "owner" : false;
  return (
    <View style={styles.wrap}>
      {detail.retired ? (
        <Notice tone="info" title={detail.mergedInto ? "Merged into another case" : "Retired"} testID="case-retired">
          <Text>{detail.retiredReason ?? ""} It no longer counts in search or the group&apos;s evidence; a lead can restore it.</Text>
        </Notice>
      ) : null}
      {detail.mergedInto ? <Button label="Open the case it was merged into" variant="secondary" onPress={() => router.push(`/cases/${detail.mergedInto}` as never)} /> : null}
      <CaseRequests caseId={detail.id} authorId={detail.authorId} userId={userId} isLead={isLead} />
    </View>
  );
}
