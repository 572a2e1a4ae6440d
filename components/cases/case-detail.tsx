import { Link } from "expo-router";
import { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useFollowCaseMutation } from "../../hooks/use-cases";
import { MAX_PHOTOS_PER_CASE, type CaseDetail, type SimilarCase } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { CaseCurationNotes } from "../desk/case-requests";
import { AddAttempt, AttemptTimeline } from "./attempts";
import { CaseEdit } from "./case-edit";
import { aqueousLine, formatDate, formatDateTime, formatMinutes, organicLine } from "./format";
import { LayerOrder } from "./layer-order";
import { PhotoGrid, PickButtons, UploadRow, type PickedPhoto } from "./photos";
import { Pill, StatusPill } from "./pill";
import { causeLabel, KIND, OUTCOME, tagLabel } from "./vocab";

function Section({ title, children, testID }: { title: string; children: React.ReactNode; testID?: string }) {
  return (
    <Card testID={testID}>
      <Text size="title" bold accessibilityRole="header">
        {title}
      </Text>
      {children}
    </Card>
  );
}

function FollowButton({ detail }: { detail: CaseDetail }) {
  const follow = useFollowCaseMutation(detail.id);
  const others = detail.followerCount - (detail.following ? 1 : 0);
  return (
    <View style={styles.followWrap}>
      <Button
        label={detail.following ? "Following ✓" : "Follow"}
        variant={detail.following ? "secondary" : "primary"}
        hint={detail.following ? "Stop following this case" : "Hear when this case changes"}
        busy={follow.isPending}
        onPress={() => follow.mutate(!detail.following)}
        testID="case-follow"
      />
      <Text size="caption" tone="inkMuted">
        {others > 0 ? `${others} other${others === 1 ? "" : "s"} following` : detail.following ? "You follow this case" : "Nobody follows it yet"}
      </Text>
      {follow.isError ? (
        <Text size="caption" tone="danger">
          {follow.error.message}
        </Text>
      ) : null}
    </View>
  );
}

/** The answer first: what worked, or where the case stands. */
function Outcome({ detail }: { detail: CaseDetail }) {
  const tone = detail.bestOutcome ? OUTCOME[detail.bestOutcome].tone : "neutral";
  return (
    <View style={[styles.answer, { borderLeftColor: tone === "neutral" ? colors.line : colors[tone] }]} testID="case-what-worked">
      {detail.whatWorked ? (
        <Text size="title" bold tone={tone === "good" ? "good" : tone === "caution" ? "caution" : "ink"}>
          {detail.whatWorked.charAt(0).toUpperCase() + detail.whatWorked.slice(1)}
        </Text>
      ) : (
        <Text size="title" bold tone="inkMuted">
          {detail.attempts.length ? "Nothing has cleared it yet" : "No attempts logged yet"}
        </Text>
      )}
      {detail.finalOutcome ? <Text>{detail.finalOutcome}</Text> : null}
      {detail.recovery && (detail.recovery.massG !== undefined || detail.recovery.percent !== undefined) ? (
        <Text tone="inkMuted">
          Recovered{" "}
          {[detail.recovery.massG !== undefined ? `${detail.recovery.massG} g` : null, detail.recovery.percent !== undefined ? `${detail.recovery.percent.toFixed(1)} %` : null]
            .filter(Boolean)
            .join(", ")}
        </Text>
      ) : null}
    </View>
  );
}

function seenLines(detail: CaseDetail): string[] {
  const s = detail.seen;
  return [
    s.kind ? KIND[s.kind] : null,
    s.emulsionFractionPct !== null ? `${s.emulsionFractionPct.toFixed(s.emulsionFractionPct < 1 ? 1 : 0)} % of the volume emulsified` : null,
    s.solids ? "solids present" : null,
    s.thirdLayer ? "a third layer" : null,
    s.cloudyOrganic ? "cloudy organic" : null,
    s.foamOrBubbles ? "foam or bubbles" : null,
    s.colour ? `colour: ${s.colour}` : null,
    s.shaking ? `${s.shaking} shaking` : null,
    s.minutesWaited !== null ? `waited ${formatMinutes(s.minutesWaited)} first` : null,
  ].filter((x): x is string => !!x);
}

function SimilarRow({ c, onOpen }: { c: SimilarCase; onOpen?: (id: string) => void }) {
  const body = (
    <>
      <Text bold>{c.title}</Text>
      <Text size="label" tone={c.whatWorked ? "good" : "inkMuted"}>
        {c.whatWorked ?? "nothing has cleared it yet"}
      </Text>
      <Text size="caption" tone="inkMuted">
        {formatDate(c.occurredAt)}
        {c.matched.length ? ` · same ${c.matched.join(", ")}` : ""}
      </Text>
    </>
  );
  if (onOpen) {
    return (
      <Pressable accessibilityRole="link" onPress={() => onOpen(c.id)} style={styles.similar} testID={`similar-${c.id}`}>
        {body}
      </Pressable>
    );
  }
  return (
    <Link href={`/cases/${c.id}` as never} asChild>
      <Pressable accessibilityRole="link" style={StyleSheet.flatten(styles.similar)} testID={`similar-${c.id}`}>
        {body}
      </Pressable>
    </Link>
  );
}

/** Everything about one case; the case page and the wide list's side pane both show it. */
export function CaseDetailView({ detail, userId, onOpenCase }: { detail: CaseDetail; userId: string; onOpenCase?: (id: string) => void }) {
  const [editing, setEditing] = useState(false);
  const [picked, setPicked] = useState<PickedPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const p = detail.predicted;
  const organicMl = detail.system.organic.reduce((s, o) => s + o.volumeMl, 0);
  const seen = seenLines(detail);
  const photoRoom = MAX_PHOTOS_PER_CASE - detail.photos.length - picked.length;

  return (
    <View style={styles.wrap}>
      <View style={styles.meta}>
        <View style={styles.pills}>
          <StatusPill status={detail.status} />
          {detail.verified ? <Pill tone="good" label="✓ Checked by a lead" /> : null}
          {detail.retired ? <Pill tone="neutral" label="Retired" /> : null}
        </View>
        <Text size="caption" tone="inkMuted">
          Logged by {detail.authorId === userId ? "you" : detail.authorName} · {formatDateTime(detail.occurredAt)}
          {detail.updatedAt !== detail.createdAt ? ` · changed ${formatDate(detail.updatedAt)}` : ""}
        </Text>
      </View>

      <CaseCurationNotes detail={detail} userId={userId} />
      <Outcome detail={detail} />
      <View style={styles.actions}>
        <FollowButton detail={detail} />
        {detail.canEdit && !editing ? <Button label="Close or update the case" variant="secondary" onPress={() => setEditing(true)} testID="case-edit-open" /> : null}
      </View>
      {editing ? (
        <Card>
          <CaseEdit detail={detail} onDone={() => setEditing(false)} />
        </Card>
      ) : null}

      {detail.layerSurprise ? (
        <Notice tone="caution" title="Layers the other way round">
          The layer check predicted {p?.bottom} at the bottom; {detail.observedBottom} was seen there. Keep both layers until the product is found.
        </Notice>
      ) : null}

      <Section title="System" testID="case-system">
        <View style={styles.kv}>
          <Text>
            <Text bold>Organic </Text>
            {organicLine(detail.system)}
          </Text>
          <Text>
            <Text bold>Aqueous </Text>
            {aqueousLine(detail.system)}
          </Text>
          <Text>
            <Text bold>Temperature </Text>
            {detail.system.temperatureC} °C
            {detail.system.scale?.funnelMl ? ` · ${detail.system.scale.funnelMl} mL funnel` : ""}
            {detail.system.scale?.productG ? ` · ${detail.system.scale.productG} g product` : ""}
          </Text>
        </View>
        <LayerOrder predicted={p} observedBottom={detail.observedBottom} organicMl={organicMl} aqueousMl={detail.system.aqueous.volumeMl} testID="case-layers" />
        {p ? (
          <Text size="caption" tone="inkMuted">
            Densities {p.organicDensityGPerMl.toFixed(3)} (organic) vs {p.aqueousDensityGPerMl.toFixed(3)} g/mL (aqueous), difference {p.densityDifferenceGPerMl.toFixed(3)} · ideal mixing assumed
            {p.confidence === "clear" ? "" : p.confidence === "close" ? " · close: confirm with a drop of water" : " · too close to call from densities"}
          </Text>
        ) : (
          <Text size="caption" tone="inkMuted">
            No prediction: a name in the system is not in the reference tables.
          </Text>
        )}
      </Section>

      {seen.length || detail.causes.length || detail.tags.length || detail.notes || detail.components.length ? (
        <Section title="What was seen" testID="case-seen">
          {seen.length ? <Text>{seen.join(" · ")}</Text> : null}
          {detail.causes.length ? (
            <Text>
              <Text bold>Suspected </Text>
              {detail.causes.map(causeLabel).join(", ")}
            </Text>
          ) : null}
          {detail.tags.length ? (
            <View style={styles.pills}>
              {detail.tags.map((t) => (
                <Pill key={t} tone="info" label={tagLabel(t)} />
              ))}
            </View>
          ) : null}
          {detail.components.length ? (
            <Text>
              <Text bold>Components </Text>
              {detail.components.map((c) => `${c.name}${c.role ? ` (${c.role.replace(/-/g, " ")})` : ""}`).join(", ")}
            </Text>
          ) : null}
          {detail.notes ? <Text>{detail.notes}</Text> : null}
        </Section>
      ) : null}

      <Section title={`Attempts${detail.attempts.length ? ` (${detail.attempts.length})` : ""}`} testID="case-attempts">
        <AttemptTimeline caseId={detail.id} attempts={detail.attempts} canEdit={detail.canEdit} />
        {detail.canEdit ? (
          <View style={styles.divider}>
            <AddAttempt caseId={detail.id} draftKey={`attempt:${userId}:${detail.id}`} nextPosition={detail.attempts.length + 1} />
          </View>
        ) : null}
      </Section>

      <Section title={`Photos${detail.photos.length ? ` (${detail.photos.length})` : ""}`} testID="case-photos">
        {detail.photos.length ? (
          <PhotoGrid caseId={detail.id} photos={detail.photos} canDelete={detail.canEdit} />
        ) : (
          <Text tone="inkMuted">No photos yet. A photo of the interface says more than a paragraph.</Text>
        )}
        {picked.map((ph) => (
          <UploadRow
            key={ph.key}
            photo={ph}
            caseId={detail.id}
            onDone={(done) => setPicked((list) => list.filter((x) => x.key !== done.key))}
            onRemove={(gone) => setPicked((list) => list.filter((x) => x.key !== gone.key))}
          />
        ))}
        {photoError ? <Notice tone="danger">{photoError}</Notice> : null}
        {detail.canEdit ? (
          photoRoom > 0 ? (
            <PickButtons
              onPicked={(ph) => {
                setPhotoError(null);
                setPicked((list) => [...list, ph]);
              }}
              onError={setPhotoError}
            />
          ) : (
            <Text size="caption" tone="inkMuted">
              This case has its {MAX_PHOTOS_PER_CASE} photos; delete one to add another.
            </Text>
          )
        ) : null}
      </Section>

      <Section title="Similar cases" testID="case-similar">
        {detail.similar.length ? (
          detail.similar.map((c) => <SimilarRow key={c.id} c={c} onOpen={onOpenCase} />)
        ) : (
          <Text tone="inkMuted">No other case in the group shares this solvent family, pH band or cause yet.</Text>
        )}
      </Section>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  meta: { gap: space.xs },
  pills: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  answer: { gap: space.xs, borderLeftWidth: 5, paddingLeft: space.md },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.md, alignItems: "flex-start" },
  followWrap: { gap: space.xs },
  kv: { gap: space.xs },
  divider: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  similar: {
    minHeight: TOUCH_MIN,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.line,
    gap: 2,
  },
});
