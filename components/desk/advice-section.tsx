import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { useLocalSearchParams, useRouter } from "expo-router";
import { FAMILY_WORDS, PH_BAND_WORDS, SOLVENT_FAMILIES, adviceScope, clearedText, type AdviceNote } from "../../knowledge/contracts/advice";
import { PH_BANDS, type CaseDetail } from "../../knowledge/contracts/cases";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { useAdviceQuery, useCreateAdviceMutation, usePatchAdviceMutation } from "../../hooks/use-advice";
import { useCaseQuery, useCasesQuery } from "../../hooks/use-cases";
import { causeLabel, remedyLabel } from "../cases/vocab";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import type { DeskSectionProps } from "./desk-sections";
import { formatDay } from "./format";
import { LinkRow } from "./link-row";

const ANY = "any";

function PromoteForm({ detail, onDone }: { detail: CaseDetail; onDone: () => void }) {
  const fix = detail.attempts.find((a) => a.id === detail.verifiedAttemptId);
  const [family, setFamily] = useState<string>(detail.solventFamily ?? ANY);
  const [band, setBand] = useState<string>(detail.phBand ?? ANY);
  const [cause, setCause] = useState<string>(ANY);
  const scope = adviceScope({ solventFamily: family === ANY ? null : family, phBand: band === ANY ? null : band });
  const title = fix?.remedyId ? (remedyLabel(fix.remedyId) ?? fix.label) : "";
  const [text, setText] = useState(title ? `In this group, for ${scope}: ${title.charAt(0).toLowerCase()}${title.slice(1)} first.` : "");
  const create = useCreateAdviceMutation();
  const err = create.error instanceof ApiError ? create.error : null;
  if (!detail.verified) {
    return <Notice tone="caution" title="Verify the case first"><Text>Only a verified fix becomes group advice. Verify “{detail.title}” in the review queue.</Text></Notice>;
  }
  if (!fix?.remedyId) {
    return (
      <Notice tone="caution" title="No catalogued fix to promote">
        <Text>“{detail.title}” was verified without a working fix from the remedy catalogue; a note needs one.</Text>
      </Notice>
    );
  }
  return (
    <View style={styles.form} testID="advice-form">
      <Text>
        From <Text bold>“{detail.title}”</Text>: {fix.label}
        {fix.amount ? ` (${fix.amount})` : ""}, {fix.outcome === "cleared" ? "cleared" : "partly cleared"}.
      </Text>
      <Chips
        label="Solvent family"
        showLabel
        scroll
        options={[{ value: ANY, label: "Any solvent" }, ...SOLVENT_FAMILIES.map((f) => ({ value: f, label: FAMILY_WORDS[f] ?? f }))]}
        selected={family}
        onSelect={setFamily}
        testID="advice-family"
      />
      <Chips
        label="Aqueous pH"
        showLabel
        scroll
        options={[{ value: ANY, label: "Any pH" }, ...PH_BANDS.map((b) => ({ value: b, label: PH_BAND_WORDS[b] }))]}
        selected={band}
        onSelect={setBand}
        testID="advice-band"
      />
      {detail.causes.length ? (
        <Chips
          label="Only when this cause is likely"
          showLabel
          options={[{ value: ANY, label: "Any cause" }, ...detail.causes.map((c) => ({ value: c, label: causeLabel(c) }))]}
          selected={cause}
          onSelect={setCause}
          testID="advice-cause"
        />
      ) : null}
      <Text size="caption" tone="inkMuted">
        Shown in the emulsion help for {scope}
        {cause === ANY ? "" : `, when the likely cause is ${causeLabel(cause).toLowerCase()}`}.
      </Text>
      <Field label="The note" value={text} onChangeText={setText} multiline error={err?.fields?.text} testID="advice-text" />
      <View style={styles.buttons}>
        <Button
          label="Promote to group advice"
          disabled={text.trim().length < 10}
          busy={create.isPending}
          onPress={() =>
            create.mutate(
              {
                caseId: detail.id,
                text: text.trim(),
                solventFamily: family === ANY ? null : (family as (typeof SOLVENT_FAMILIES)[number]),
                phBand: band === ANY ? null : (band as (typeof PH_BANDS)[number]),
                causeCode: cause === ANY ? null : (cause as never),
              },
              { onSuccess: onDone },
            )
          }
          testID="advice-promote"
        />
        <Button label="Cancel" variant="quiet" onPress={onDone} />
      </View>
      {err && !err.fields?.text ? <Text tone="danger">{err.message}</Text> : null}
    </View>
  );
}

/** Pick a verified case whose fix becomes the note. */
function CasePicker({ onPick }: { onPick: (id: string) => void }) {
  const [q, setQ] = useState("");
  const list = useCasesQuery({ verified: true, q: q.trim() || undefined, limit: 8 });
  return (
    <View style={styles.form}>
      <Field label="Find a verified case" value={q} onChangeText={setQ} placeholder="title, solvent, remedy…" testID="advice-case-search" />
      {list.isPending ? <Loading /> : null}
      {(list.data?.cases ?? []).map((c) => (
        <LinkRow key={c.id} label={c.title} detail={c.whatWorked ?? undefined} onPress={() => onPick(c.id)} testID={`advice-pick-${c.id}`} />
      ))}
      {list.isSuccess && list.data.cases.length === 0 ? <Text tone="inkMuted">No verified case matches. Verify cases in the review queue first.</Text> : null}
    </View>
  );
}

function Promote({ caseId, setCaseId }: { caseId: string | null; setCaseId: (id: string | null) => void }) {
  const detail = useCaseQuery(caseId ?? undefined);
  return (
    <Card>
      <Text size="title" bold>
        Promote a verified fix
      </Text>
      {!caseId ? <CasePicker onPick={setCaseId} /> : detail.isPending ? <Loading /> : detail.isError ? <ErrorState error={detail.error} /> : <PromoteForm detail={detail.data} onDone={() => setCaseId(null)} />}
    </Card>
  );
}

function NoteCard({ note: n, canAct }: { note: AdviceNote; canAct: boolean }) {
  const router = useRouter();
  const patch = usePatchAdviceMutation();
  const [mode, setMode] = useState<"view" | "retire" | "edit">("view");
  const [reason, setReason] = useState("");
  const [text, setText] = useState(n.text);
  const err = patch.error instanceof ApiError ? patch.error : null;
  const done = () => setMode("view");
  return (
    <Card testID={`advice-note-${n.id}`} style={n.retired ? styles.retired : undefined}>
      <View style={styles.head}>
        <Text size="title" bold style={styles.grow}>
          {n.remedyTitle}
        </Text>
        <View style={[styles.badge, n.evidence.tried ? styles.badgeGood : null]}>
          <Text bold size="label" tone={n.evidence.tried ? "good" : "inkMuted"}>
            {clearedText(n.evidence)}
          </Text>
        </View>
      </View>
      <Text size="caption" tone="inkMuted">
        For {n.scope}
        {n.causeCode ? `, when the likely cause is ${causeLabel(n.causeCode).toLowerCase()}` : ""}
      </Text>
      <Text>{n.text}</Text>
      <View style={styles.sources}>
        <Text size="caption" bold>
          From
        </Text>
        {n.sources.map((s) => (
          <LinkRow key={s.id} label={`${s.title}${s.retired ? " (retired)" : ""}`} detail={s.whatWorked ?? undefined} onPress={() => router.push(`/cases/${s.id}` as never)} />
        ))}
      </View>
      <Text size="caption" tone="inkMuted">
        {n.createdBy.name} · {formatDay(n.createdAt)} · version {n.version}
        {n.retired ? ` · retired${n.retiredReason ? `: ${n.retiredReason}` : ""}` : ""}
      </Text>
      {canAct && mode === "retire" ? (
        <View style={styles.form}>
          <Field label="Why retire it" value={reason} onChangeText={setReason} error={err?.fields?.reason} testID={`advice-reason-${n.id}`} />
          <View style={styles.buttons}>
            <Button label="Retire the note" variant="danger" disabled={reason.trim().length < 3} busy={patch.isPending} onPress={() => patch.mutate({ id: n.id, retired: true, reason: reason.trim() }, { onSuccess: done })} />
            <Button label="Cancel" variant="quiet" onPress={done} />
          </View>
        </View>
      ) : null}
      {canAct && mode === "edit" ? (
        <View style={styles.form}>
          <Field label="The note" value={text} onChangeText={setText} multiline error={err?.fields?.text} />
          <View style={styles.buttons}>
            <Button label="Save" disabled={text.trim().length < 10} busy={patch.isPending} onPress={() => patch.mutate({ id: n.id, text: text.trim() }, { onSuccess: done })} />
            <Button label="Cancel" variant="quiet" onPress={done} />
          </View>
        </View>
      ) : null}
      {canAct && mode === "view" ? (
        <View style={styles.buttons}>
          {n.retired ? (
            <Button label="Bring it back" variant="secondary" busy={patch.isPending} onPress={() => patch.mutate({ id: n.id, retired: false })} />
          ) : (
            <>
              <Button label="Edit" variant="secondary" onPress={() => setMode("edit")} />
              <Button label="Retire" variant="quiet" onPress={() => setMode("retire")} testID={`advice-retire-${n.id}`} />
            </>
          )}
        </View>
      ) : null}
      {err && mode === "view" ? <Text tone="danger">{err.message}</Text> : null}
    </Card>
  );
}

/** Desk › Advice: the group's notes on remedies, each resting on verified cases; promote a new one. */
export function AdviceSection({ canAct }: DeskSectionProps) {
  const params = useLocalSearchParams<{ case?: string }>();
  const [caseId, setCaseId] = useState<string | null>(typeof params.case === "string" ? params.case : null);
  const [promoting, setPromoting] = useState(caseId !== null);
  const [showRetired, setShowRetired] = useState(false);
  const q = useAdviceQuery(showRetired);
  return (
    <View style={styles.section}>
      {canAct && promoting ? (
        <Promote
          caseId={caseId}
          setCaseId={(id) => {
            setCaseId(id);
            if (id === null) setPromoting(false);
          }}
        />
      ) : canAct ? (
        <View style={styles.buttons}>
          <Button label="Promote a verified fix" onPress={() => setPromoting(true)} testID="advice-start" />
        </View>
      ) : null}
      <Chips
        label="Notes to show"
        options={[
          { value: "live", label: "In force" },
          { value: "all", label: "Include retired" },
        ]}
        selected={showRetired ? "all" : "live"}
        onSelect={(v) => setShowRetired(v === "all")}
        testID="advice-show"
      />
      {q.isPending ? (
        <Loading label="Loading the group's advice…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.notes.length === 0 ? (
        <Empty
          title="No group advice yet"
          body="A note says what works in this group for a kind of system. It appears beside its remedy in the emulsion help. Verify a case, then promote its fix."
        />
      ) : (
        <View style={styles.notes}>
          {q.data.notes.map((n) => (
            <NoteCard key={`${n.id}-${n.version}`} note={n} canAct={canAct} />
          ))}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  form: { gap: space.md },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  notes: { gap: space.md },
  head: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 160 },
  badge: { borderRadius: radii.pill, paddingHorizontal: space.md, paddingVertical: space.xs, backgroundColor: colors.paper },
  badgeGood: { backgroundColor: colors.goodSoft },
  sources: { gap: 2 },
  retired: { opacity: 0.75 },
});
