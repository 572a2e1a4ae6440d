import { useMemo, useRef, useState } from "react";
import { StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import type { CasePrefill } from "../../hooks/case-prefill";
import { colors, space } from "../../hooks/theme";
import { useCreateCaseMutation } from "../../hooks/use-cases";
import { useDraft } from "../../hooks/use-draft";
import { MAX_PHOTOS_PER_CASE, type CaseDetail } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { caseBodyFromDraft, draftFromPrefill, emptyCaseDraft, suggestedTitle, type CaseDraftValue, type FieldErrors } from "./case-draft";
import { ChoiceChips, ToggleChips } from "./choice-chips";
import { LayerPreview } from "./layer-preview";
import { PickButtons, UploadRow, type PickedPhoto } from "./photos";
import { SystemFields } from "./system-fields";
import { CAUSE_CHOICES, FLAG_CHOICES, KIND_CHOICES, PHASE_CHOICES, SHAKING_CHOICES, TAG_CHOICES } from "./vocab";

export interface CaseFormProps {
  /** storage key of the draft; include the user so a shared device keeps drafts apart */
  draftKey: string;
  prefill?: CasePrefill | null;
  /** after the case and its photos are saved */
  onCreated: (c: CaseDetail) => void;
}

function when(d: Date): string {
  return d.toLocaleTimeString(undefined, { hour: "2-digit", minute: "2-digit" });
}

const FIELD_NAMES: [RegExp, string][] = [
  [/^title$/, "Title"],
  [/^system\.organic\.(\d+)\.solvent$/, "Solvent"],
  [/^system\.organic\.(\d+)\.volumeMl$/, "Solvent volume"],
  [/^system\.organic$/, "Organic phase"],
  [/^system\.aqueous\.solute$/, "Aqueous solution"],
  [/^system\.aqueous\.volumeMl$/, "Aqueous volume"],
  [/^system\.aqueous\.concentration/, "Concentration"],
  [/^system\.aqueous\.ph$/, "pH"],
  [/^system\.temperatureC$/, "Temperature"],
  [/^system\.scale/, "Scale"],
  [/^seen\./, "What you see"],
  [/^tags/, "Tags"],
  [/^notes$/, "Notes"],
];

function fieldName(key: string): string {
  return FIELD_NAMES.find(([re]) => re.test(key))?.[1] ?? "Form";
}

/**
 * The new-case form. Everything typed lives in a local draft until the server has the case,
 * so a locked phone or a dropped connection loses nothing; a failed save keeps it all.
 */
export function CaseForm({ draftKey, prefill, onCreated }: CaseFormProps) {
  const draft = useDraft<CaseDraftValue>(draftKey, () => (prefill ? draftFromPrefill(prefill) : emptyCaseDraft()));
  const d = draft.value;
  const set = draft.set;
  const create = useCreateCaseMutation();
  const [errors, setErrors] = useState<FieldErrors>({});
  const [photos, setPhotos] = useState<PickedPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [saved, setSaved] = useState<CaseDetail | null>(null);
  // Refs, not state: several uploads finish on their own schedule and each must see the others.
  const uploaded = useRef(new Set<string>());
  const photosRef = useRef<PickedPhoto[]>([]);
  photosRef.current = photos;
  // Open the details when a link or a restored draft already filled some of them.
  const [more, setMore] = useState(() => d.causes.length > 0 || d.tags.length > 0 || d.notes !== "" || d.funnel !== "");
  const placeholderTitle = useMemo(() => suggestedTitle(d), [d]);

  const finishIfDone = (c: CaseDetail) => {
    if (photosRef.current.every((p) => uploaded.current.has(p.key))) onCreated(c);
  };

  const submit = () => {
    const { body, errors: found } = caseBodyFromDraft(d);
    setErrors(found);
    if (!body) return;
    create.mutate(body, {
      onSuccess: (c) => {
        // The case exists: the draft has done its job. Photos upload next, each with its bar.
        draft.clear();
        setSaved(c);
        finishIfDone(c);
      },
      onError: (e) => {
        if (e instanceof ApiError && e.fields) setErrors(e.fields);
      },
    });
  };

  const errorKeys = Object.keys(errors);
  const serverMessage = create.error instanceof ApiError && !create.error.fields ? create.error.message : create.isError && !(create.error instanceof ApiError) ? "The case did not reach the server. Your entries are kept here: try again when the connection is back." : null;

  return (
    <View style={styles.form}>
      {draft.restoredAt && !saved ? (
        <Notice tone="info" title={`Picking up your unsaved case from ${when(draft.restoredAt)}`} testID="draft-restored">
          <View style={styles.row}>
            {prefill ? (
              <Button label="Use the linked system instead" variant="secondary" onPress={() => set(draftFromPrefill(prefill))} testID="draft-use-link" />
            ) : null}
            <Button label="Start over" variant="quiet" onPress={draft.clear} testID="draft-start-over" />
          </View>
        </Notice>
      ) : prefill && !saved ? (
        <Notice tone="info" testID="prefilled">
          Filled in from the system you were checking. Change anything that differs at the funnel.
        </Notice>
      ) : null}

      <Card>
        <SystemFields draft={d} set={set} errors={errors} />
      </Card>

      <Card>
        <Text size="title" bold accessibilityRole="header">
          What you see
        </Text>
        <ChoiceChips
          label="Which layer is at the bottom?"
          choices={PHASE_CHOICES}
          value={d.observedBottom}
          onChange={(v) => set((x) => ({ ...x, observedBottom: v }))}
          testID="observed"
        />
        <LayerPreview draft={d} />
        <ChoiceChips label="The interface" choices={KIND_CHOICES} value={d.kind} onChange={(v) => set((x) => ({ ...x, kind: v }))} testID="kind" />
        <Field
          label="Share of the volume that is emulsified (%)"
          value={d.emulsionPct}
          onChangeText={(t) => set((x) => ({ ...x, emulsionPct: t }))}
          inputMode="decimal"
          placeholder="e.g. 20"
          error={errors["seen.emulsionFractionPct"]}
          testID="emulsion-pct"
        />
        <ToggleChips label="Also seen" choices={FLAG_CHOICES} values={d.flags} onChange={(v) => set((x) => ({ ...x, flags: v }))} testID="flag" />
      </Card>

      <Card>
        <Text size="title" bold accessibilityRole="header">
          Photos
        </Text>
        <Text size="caption" tone="inkMuted">
          Up to {MAX_PHOTOS_PER_CASE}, JPEG, PNG or WebP, 10 MB each. Location data is removed on upload. Photos stay on this page until the case is saved.
        </Text>
        {photos.map((p) => (
          <UploadRow
            key={p.key}
            photo={p}
            caseId={saved?.id ?? null}
            onDone={(ph) => {
              uploaded.current.add(ph.key);
              if (saved) finishIfDone(saved);
            }}
            onRemove={(ph) => {
              photosRef.current = photosRef.current.filter((x) => x.key !== ph.key);
              setPhotos(photosRef.current);
              if (saved) finishIfDone(saved);
            }}
          />
        ))}
        {photoError ? (
          <Notice tone="danger" testID="photo-error">
            {photoError}
          </Notice>
        ) : null}
        {!saved ? (
          <PickButtons
            disabled={photos.length >= MAX_PHOTOS_PER_CASE}
            onPicked={(p) => {
              setPhotoError(null);
              setPhotos((list) => [...list, p]);
            }}
            onError={setPhotoError}
          />
        ) : null}
      </Card>

      <Card>
        <Field
          label="Title"
          value={d.title}
          onChangeText={(t) => set((x) => ({ ...x, title: t }))}
          placeholder={placeholderTitle || "What happened, in a few words"}
          help={placeholderTitle && !d.title ? "Leave empty to use the suggestion" : undefined}
          error={errors.title}
          testID="case-title"
        />
        <Field
          label="Notes"
          value={d.notes}
          onChangeText={(t) => set((x) => ({ ...x, notes: t }))}
          multiline
          numberOfLines={3}
          placeholder="Reaction, what you did before the work-up, anything odd"
          error={errors.notes}
          testID="case-notes"
        />
        <Button
          label={more ? "Fewer details" : "More details: causes, tags, scale, pH"}
          variant="quiet"
          onPress={() => setMore((m) => !m)}
          testID="case-more"
        />
        {more ? (
          <View style={styles.more}>
            <ToggleChips label="Suspected cause" choices={CAUSE_CHOICES} values={d.causes} onChange={(v) => set((x) => ({ ...x, causes: v }))} testID="cause" />
            <ToggleChips label="Reaction or work-up" choices={TAG_CHOICES} values={d.tags} onChange={(v) => set((x) => ({ ...x, tags: v }))} testID="tag" />
            <Field
              label="Other tags"
              value={d.otherTags}
              onChangeText={(t) => set((x) => ({ ...x, otherTags: t }))}
              placeholder="comma separated"
              autoCapitalize="none"
              error={errors.tags}
              testID="case-other-tags"
            />
            <ChoiceChips label="Shaking" choices={SHAKING_CHOICES} value={d.shaking} onChange={(v) => set((x) => ({ ...x, shaking: v }))} testID="shaking" />
            <View style={styles.row}>
              <View style={styles.grow}>
                <Field label="Minutes waited" value={d.minutesWaited} onChangeText={(t) => set((x) => ({ ...x, minutesWaited: t }))} inputMode="decimal" error={errors["seen.minutesWaited"]} testID="minutes-waited" />
              </View>
              <View style={styles.grow}>
                <Field label="Aqueous pH" value={d.aqueous.ph} onChangeText={(t) => set((x) => ({ ...x, aqueous: { ...x.aqueous, ph: t } }))} inputMode="decimal" error={errors["system.aqueous.ph"]} testID="aqueous-ph" />
              </View>
            </View>
            <View style={styles.row}>
              <View style={styles.grow}>
                <Field label="Funnel size" value={d.funnel} onChangeText={(t) => set((x) => ({ ...x, funnel: t }))} placeholder="250 mL" error={errors["system.scale.funnelMl"]} testID="funnel" />
              </View>
              <View style={styles.grow}>
                <Field label="Product (g)" value={d.productG} onChangeText={(t) => set((x) => ({ ...x, productG: t }))} inputMode="decimal" error={errors["system.scale.productG"]} testID="product-g" />
              </View>
            </View>
            <Field label="Colour" value={d.colour} onChangeText={(t) => set((x) => ({ ...x, colour: t }))} placeholder="e.g. yellow band, grey solids" error={errors["seen.colour"]} testID="colour" />
          </View>
        ) : null}
      </Card>

      {errorKeys.length ? (
        <Notice tone="danger" title="Some fields need attention" testID="case-errors">
          {errorKeys.map((k) => (
            <Text key={k}>
              {fieldName(k)}: {errors[k]}
            </Text>
          ))}
        </Notice>
      ) : null}
      {serverMessage ? (
        <Notice tone="danger" title="Not saved yet" testID="case-save-error">
          {serverMessage}
        </Notice>
      ) : null}
      {saved ? (
        <Notice tone="good" title="Case saved" testID="case-saved">
          {photos.length ? "Uploading the photos…" : "Opening the case…"}
        </Notice>
      ) : (
        <Button label="Save case" onPress={submit} busy={create.isPending} testID="case-save" />
      )}
      {saved && photos.length ? <Button label="Open the case without waiting" variant="secondary" onPress={() => onCreated(saved)} testID="case-open" /> : null}
      <View style={styles.spacer} />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.md, alignItems: "flex-end" },
  grow: { flexGrow: 1, flexBasis: 140 },
  more: { gap: space.md, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  spacer: { height: space.lg },
});
