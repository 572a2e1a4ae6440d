import { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { useRouter } from "expo-router";
import type { CaseAttempt, CaseDetail } from "../../knowledge/contracts/cases";
import { RETIRE_CODES, RETIRE_LABELS, type RetireCode, type ReviewItem } from "../../knowledge/contracts/curation";
import { ApiError } from "../../hooks/api";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useCaseQuery, useCasesQuery } from "../../hooks/use-cases";
import { useMergeMutation, useRestoreCaseMutation, useRetireMutation, useVerifyMutation } from "../../hooks/use-curation";
import { aqueousLine, formatDate, formatMinutes, organicLine } from "../cases/format";
import { OutcomePill, Pill, StatusPill } from "../cases/pill";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { CaseRequests } from "./case-requests";
import { LinkRow } from "./link-row";

const CHECK_TONE = { danger: "danger", caution: "caution", info: "info" } as const;

/** An attempt that may be the working fix: it cleared or partly cleared the emulsion. */
const canBeFix = (a: CaseAttempt) => a.outcome === "cleared" || a.outcome === "partly";

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

function errorText(e: unknown): string | null {
  return e instanceof ApiError ? e.message : e ? "Something went wrong; try again." : null;
}

/** Attempts in order; the lead picks the one that worked. */
function FixPicker({ detail, chosen, onChoose }: { detail: CaseDetail; chosen: string | null; onChoose: (id: string) => void }) {
  if (detail.attempts.length === 0) return <Text tone="inkMuted">No attempts logged.</Text>;
  return (
    <View style={styles.attempts} accessibilityRole="radiogroup" accessibilityLabel="The working fix">
      {detail.attempts.map((a) => {
        const selectable = canBeFix(a);
        const on = chosen === a.id;
        return (
          <Pressable
            key={a.id}
            accessibilityRole="radio"
            accessibilityState={{ checked: on, disabled: !selectable }}
            accessibilityLabel={`${a.position}. ${a.label}, ${a.outcome}`}
            disabled={!selectable}
            onPress={() => onChoose(a.id)}
            style={[styles.attempt, on && styles.attemptOn]}
            testID={`fix-${a.position}`}
          >
            <Text bold tone={on ? "brand" : "ink"}>
              {on ? "◉" : selectable ? "○" : " "} {a.position}. {a.label}
            </Text>
            <View style={styles.attemptMeta}>
              <OutcomePill outcome={a.outcome} />
              {a.minutes !== null ? (
                <Text size="caption" tone="inkMuted">
                  {formatMinutes(a.minutes)}
                </Text>
              ) : null}
              {a.amount ? (
                <Text size="caption" tone="inkMuted">
                  {a.amount}
                </Text>
              ) : null}
            </View>
          </Pressable>
        );
      })}
    </View>
  );
}

function MergeBox({ detail }: { detail: CaseDetail }) {
  const [text, setText] = useState("");
  const [target, setTarget] = useState<{ id: string; title: string } | null>(null);
  const found = useCasesQuery({ q: text.trim() || undefined, limit: 6 });
  const merge = useMergeMutation();
  const candidates = (found.data?.cases ?? []).filter((c) => c.id !== detail.id);
  return (
    <View style={styles.box}>
      <Text bold size="label">
        Merge a duplicate
      </Text>
      <Text size="caption" tone="inkMuted">
        This case&apos;s attempts, photos and followers move to the case you keep; this one then points to it. A restore undoes it.
      </Text>
      {target ? (
        <View style={styles.box}>
          <Notice tone="caution" title="Merge into the case you keep?">
            <Text>“{detail.title}” goes into “{target.title}”.</Text>
          </Notice>
          <View style={styles.buttons}>
            <Button
              label="Yes, merge"
              variant="danger"
              busy={merge.isPending}
              onPress={() => merge.mutate({ caseId: detail.id, into: target.id }, { onSuccess: () => setTarget(null) })}
              testID="merge-confirm"
            />
            <Button label="Cancel" variant="quiet" onPress={() => setTarget(null)} />
          </View>
        </View>
      ) : (
        <>
          <Field label="Find the case to keep" value={text} onChangeText={setText} placeholder="title, solvent, remedy…" testID="merge-search" />
          {candidates.slice(0, 5).map((c) => (
            <LinkRow key={c.id} label={`Keep “${c.title}”`} detail={c.whatWorked ?? undefined} onPress={() => setTarget({ id: c.id, title: c.title })} testID={`merge-into-${c.id}`} />
          ))}
          {text.trim() && found.isSuccess && candidates.length === 0 ? <Text tone="inkMuted">No other case matches.</Text> : null}
        </>
      )}
      {errorText(merge.error) ? <Text tone="danger">{errorText(merge.error)}</Text> : null}
    </View>
  );
}

function RetireBox({ caseId }: { caseId: string }) {
  const [code, setCode] = useState<RetireCode | null>(null);
  const [reason, setReason] = useState("");
  const retire = useRetireMutation();
  const err = retire.error instanceof ApiError ? retire.error : null;
  return (
    <View style={styles.box}>
      <Text bold size="label">
        Retire
      </Text>
      <Text size="caption" tone="inkMuted">
        Retired cases leave the lists, search and the group&apos;s evidence; nothing is deleted and a restore brings them back.
      </Text>
      <Chips label="Why" options={RETIRE_CODES.map((c) => ({ value: c, label: RETIRE_LABELS[c] }))} selected={code} onSelect={setCode} testID="retire-code" />
      <Field label="Reason" value={reason} onChangeText={setReason} error={err?.fields?.reason} testID="retire-reason" />
      <Button
        label="Retire this case"
        variant="danger"
        disabled={!code || reason.trim().length < 3}
        busy={retire.isPending}
        onPress={() => code && retire.mutate({ caseId, code, reason: reason.trim() })}
        testID="retire-submit"
      />
      {err && !err.fields ? <Text tone="danger">{err.message}</Text> : null}
    </View>
  );
}

/** The review pane: the case at a glance, the checks, and every curation action on it. */
export function ReviewDetail({ caseId, item, userId, onClose }: { caseId: string; item?: ReviewItem; userId: string; onClose: () => void }) {
  const q = useCaseQuery(caseId);
  const router = useRouter();
  const verify = useVerifyMutation();
  const restore = useRestoreCaseMutation();
  const [chosen, setChosen] = useState<string | null>(null);
  if (q.isPending) return <Loading label="Loading the case…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const d = q.data;
  const fix = chosen ?? d.verifiedAttemptId ?? item?.fixAttemptId ?? d.attempts.find((a) => a.outcome === "cleared")?.id ?? null;
  const fixAttempt = d.attempts.find((a) => a.id === fix);
  const promotable = d.verified && d.verifiedAttemptId && d.attempts.find((a) => a.id === d.verifiedAttemptId)?.remedyId;

  return (
    <Card testID="review-detail">
      <View style={styles.head}>
        <Text size="title" bold style={styles.grow} accessibilityRole="header">
          {d.title}
        </Text>
        <Button label="Close" variant="quiet" onPress={onClose} testID="review-close" />
      </View>
      <View style={styles.pills}>
        <StatusPill status={d.status} />
        {d.verified ? <Pill tone="good" label="✓ Verified" /> : null}
        {d.retired ? <Pill tone="neutral" label={d.mergedInto ? "Merged" : "Retired"} /> : null}
      </View>
      <Text size="caption" tone="inkMuted">
        {d.authorName} · {formatDate(d.occurredAt)} · {plural(d.attempts.length, "attempt")} · {plural(d.photos.length, "photo")}
      </Text>
      <Text>
        <Text bold>Organic </Text>
        {organicLine(d.system)}
      </Text>
      <Text>
        <Text bold>Aqueous </Text>
        {aqueousLine(d.system)}
      </Text>
      {d.notes ? <Text numberOfLines={4}>{d.notes}</Text> : null}
      <Button label="Open the case page" variant="quiet" onPress={() => router.push(`/cases/${d.id}` as never)} testID="review-open-case" />

      {d.retired ? (
        <View style={styles.box}>
          <Notice tone="info" title={d.mergedInto ? "Merged into another case" : "Retired"}>
            {d.retiredReason ?? ""}
          </Notice>
          <Button
            label={d.mergedInto ? "Restore (undo the merge)" : "Restore this case"}
            busy={restore.isPending}
            onPress={() => restore.mutate({ caseId: d.id })}
            testID="review-restore"
          />
          {errorText(restore.error) ? <Text tone="danger">{errorText(restore.error)}</Text> : null}
        </View>
      ) : (
        <>
          {item?.checks.length ? (
            <View style={styles.box} testID="review-checks">
              <Text bold size="label">
                Before verifying
              </Text>
              {item.checks.map((c) => (
                <Notice key={`${c.code}-${c.message}`} tone={CHECK_TONE[c.tone]}>
                  {c.message}
                </Notice>
              ))}
            </View>
          ) : null}

          <View style={styles.box}>
            <Text bold size="label">
              The working fix
            </Text>
            <FixPicker detail={d} chosen={fix} onChoose={setChosen} />
            {d.verified ? (
              <Notice tone="good" title="Verified" testID="review-verified">
                <Text>{d.verifiedAt ? `On ${formatDate(d.verifiedAt)}` : ""}
                {fixAttempt ? ` · fix: ${fixAttempt.label}` : " · no working fix"}</Text>
              </Notice>
            ) : null}
            <View style={styles.buttons}>
              {!d.verified || (fix && fix !== d.verifiedAttemptId) ? (
                <Button
                  label={fixAttempt ? `Verify with “${fixAttempt.label}”` : "Verify (no working fix)"}
                  busy={verify.isPending}
                  onPress={() => verify.mutate({ caseId: d.id, ...(fix ? { attemptId: fix } : {}) })}
                  testID="review-verify"
                />
              ) : null}
              {promotable ? (
                <Button
                  label="Promote the fix to group advice"
                  variant="secondary"
                  onPress={() => router.push(`/desk/advice?case=${d.id}` as never)}
                  testID="review-promote"
                />
              ) : null}
            </View>
            {errorText(verify.error) ? <Text tone="danger">{errorText(verify.error)}</Text> : null}
          </View>

          <CaseRequests caseId={d.id} authorId={d.authorId} userId={userId} isLead />
          <MergeBox detail={d} />
          <RetireBox caseId={d.id} />
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: "row", alignItems: "flex-start", gap: space.sm },
  grow: { flex: 1, minWidth: 0 },
  pills: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  box: { gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  attempts: { gap: space.xs },
  attempt: { minHeight: TOUCH_MIN, padding: space.sm, borderRadius: radii.sm, borderWidth: 1, borderColor: colors.line, gap: 2 },
  attemptOn: { borderColor: colors.brand, borderWidth: 2, backgroundColor: colors.infoSoft },
  attemptMeta: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
});
