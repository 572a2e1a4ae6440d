import { useState } from "react";
import { StyleSheet, View } from "react-native";
import type { AuditEntry } from "../../knowledge/contracts/audit";
import { SOLVENT_VALUE_FIELDS } from "../../knowledge/contracts/reference-overrides";
import type { SolventValueField } from "../../knowledge/overrides";
import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { useAuditQuery, useAuditRestoreMutation, type AuditFilters } from "../../hooks/use-audit";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { DataTable, type Column } from "./data-table";
import type { DeskSectionProps } from "./desk-sections";
import { actionLabel, changesBetween, entityLabel, formatWhen, recordLabel } from "./format";

const PAGE = 50;

/** A solvent's or solution's name, or a correctable value's label, for the Record column. */
function referenceName(key: string): string | undefined {
  return (
    SHIPPED_REFERENCE.solvents.find((s) => s.key === key)?.name ??
    SHIPPED_REFERENCE.solutes.find((s) => s.key === key)?.name ??
    (key in SOLVENT_VALUE_FIELDS ? SOLVENT_VALUE_FIELDS[key as SolventValueField].label : undefined)
  );
}
const ALL = "__all__";
const DATE = /^\d{4}-\d{2}-\d{2}$/;

function Changes({ entry }: { entry: AuditEntry }) {
  const changes = changesBetween(entry.before, entry.after);
  if (changes.length === 0) return null;
  return (
    <View style={styles.changes} accessibilityLabel="What changed">
      {changes.slice(0, 8).map((c) => (
        <Text key={c.path} size="caption">
          <Text size="caption" bold>
            {c.path}
          </Text>
          : {c.before} → {c.after}
        </Text>
      ))}
      {changes.length > 8 ? (
        <Text size="caption" tone="inkMuted">
          and {changes.length - 8} more
        </Text>
      ) : null}
    </View>
  );
}

function RestoreButtons({ entry }: { entry: AuditEntry }) {
  const restore = useAuditRestoreMutation();
  const err = restore.error instanceof ApiError ? restore.error : null;
  return (
    <View style={styles.restore}>
      <View style={styles.buttons}>
        <Button
          variant="secondary"
          label={entry.before === null ? "Undo (back to before it existed)" : "Restore the version before"}
          busy={restore.isPending && restore.variables?.version === "before"}
          onPress={() => restore.mutate({ id: entry.id, version: "before" })}
          testID={`restore-before-${entry.id}`}
        />
        {entry.after !== null ? (
          <Button
            variant="quiet"
            label="Re-apply this version"
            busy={restore.isPending && restore.variables?.version === "after"}
            onPress={() => restore.mutate({ id: entry.id, version: "after" })}
            testID={`restore-after-${entry.id}`}
          />
        ) : null}
      </View>
      {err ? <Text tone="danger">{err.message}</Text> : null}
      {restore.isSuccess ? <Text tone="good">Restored; the log shows the restore as a new entry.</Text> : null}
    </View>
  );
}

const COLUMNS: Column<AuditEntry>[] = [
  { key: "when", title: "When", sortValue: (e) => e.createdAt, render: (e) => formatWhen(e.createdAt) },
  { key: "who", title: "Who", sortValue: (e) => e.actor?.name ?? "", render: (e) => e.actor?.name ?? "System" },
  {
    key: "action",
    title: "Action",
    flex: 1.3,
    sortValue: (e) => e.action,
    render: (e) => (
      <View>
        <Text bold>{actionLabel(e.action)}</Text>
        {e.restoredFrom ? (
          <Text size="caption" tone="inkMuted">
            from an earlier entry
          </Text>
        ) : null}
      </View>
    ),
  },
  {
    key: "record",
    title: "Record",
    flex: 1.5,
    sortValue: (e) => `${e.entityType} ${e.entityId}`,
    render: (e) => (
      <View>
        <Text>{entityLabel(e.entityType)}</Text>
        <Text size="caption" tone="inkMuted" numberOfLines={2}>
          {recordLabel(e, referenceName)}
        </Text>
      </View>
    ),
  },
  { key: "reason", title: "Reason", flex: 1.5, render: (e) => e.reason ?? "—" },
];

function FilterChips({ label, options, value, onChange, testID }: { label: string; options: { value: string; label: string }[]; value?: string; onChange: (v?: string) => void; testID: string }) {
  if (options.length === 0) return null;
  return (
    <Chips
      label={label}
      showLabel
      scroll
      options={[{ value: ALL, label: "All" }, ...options]}
      selected={value ?? ALL}
      onSelect={(v) => onChange(v === ALL ? undefined : v)}
      testID={testID}
    />
  );
}

/** Desk › Audit log: every curation action, filterable; a lead brings back an earlier version. */
export function AuditSection({ canAct }: DeskSectionProps) {
  const [filters, setFilters] = useState<AuditFilters>({ sort: "newest", limit: PAGE });
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const q = useAuditQuery(filters, canAct);
  const set = (patch: Partial<AuditFilters>) => setFilters((f) => ({ ...f, ...patch, limit: PAGE }));
  if (!canAct) {
    return <Text tone="inkMuted">The audit log records who changed what and when; leads and owners read it and restore from it.</Text>;
  }
  const dateError = (v: string) => (v && !DATE.test(v) ? "Use a date like 2025-03-14." : undefined);
  const facets = q.data?.facets;
  return (
    <View style={styles.section}>
      <Card>
        <Text size="title" bold>
          Filter
        </Text>
        <FilterChips
          label="Kind of record"
          options={(facets?.entityTypes ?? []).map((t) => ({ value: t, label: entityLabel(t) }))}
          value={filters.entity}
          onChange={(entity) => set({ entity })}
          testID="audit-entity"
        />
        <FilterChips
          label="Action"
          options={(facets?.actions ?? []).map((a) => ({ value: a, label: actionLabel(a) }))}
          value={filters.action}
          onChange={(action) => set({ action })}
          testID="audit-action"
        />
        <FilterChips
          label="Who"
          options={(facets?.actors ?? []).map((a) => ({ value: a.id, label: a.name }))}
          value={filters.actor}
          onChange={(actor) => set({ actor })}
          testID="audit-actor"
        />
        <View style={styles.dates}>
          <View style={styles.date}>
            <Field
              label="From (date)"
              value={from}
              onChangeText={setFrom}
              onBlur={() => !dateError(from) && set({ from: from || undefined })}
              onSubmitEditing={() => !dateError(from) && set({ from: from || undefined })}
              help="A day as YYYY-MM-DD."
              error={dateError(from)}
              testID="audit-from"
            />
          </View>
          <View style={styles.date}>
            <Field
              label="To (date)"
              value={to}
              onChangeText={setTo}
              onBlur={() => !dateError(to) && set({ to: to || undefined })}
              onSubmitEditing={() => !dateError(to) && set({ to: to || undefined })}
              help="A day as YYYY-MM-DD; the whole day counts."
              error={dateError(to)}
              testID="audit-to"
            />
          </View>
        </View>
        <Chips
          label="Order"
          options={[
            { value: "newest", label: "Newest first" },
            { value: "oldest", label: "Oldest first" },
          ]}
          selected={filters.sort ?? "newest"}
          onSelect={(sort) => set({ sort })}
          testID="audit-sort"
        />
      </Card>
      {q.isPending ? (
        <Loading label="Loading the log…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.entries.length === 0 ? (
        <Empty title="Nothing logged here yet" body="Curation actions — corrections, verifications, merges, invitations — appear here as they happen." />
      ) : (
        <>
          <Text tone="inkMuted">
            {q.data.entries.length} of {q.data.total} entries
          </Text>
          <DataTable
            label="Audit log"
            rows={q.data.entries}
            columns={COLUMNS}
            rowKey={(e) => e.id}
            below={(e) => (
              <View style={styles.below}>
                <Changes entry={e} />
                {e.restorable ? <RestoreButtons entry={e} /> : null}
              </View>
            )}
            testID="audit"
          />
          {q.data.entries.length < q.data.total ? (
            <Button variant="secondary" label="Show more" busy={q.isFetching} onPress={() => setFilters((f) => ({ ...f, limit: (f.limit ?? PAGE) + PAGE }))} />
          ) : null}
        </>
      )}
      {q.isError && q.error instanceof ApiError && q.error.status === 400 ? <Notice tone="caution">Check the dates: {q.error.message}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  dates: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  date: { flexGrow: 1, minWidth: 160 },
  below: { gap: space.sm },
  changes: { gap: 2, padding: space.sm, borderRadius: radii.sm, backgroundColor: colors.paper },
  restore: { gap: space.xs },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
