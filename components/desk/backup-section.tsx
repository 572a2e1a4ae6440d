import { useState } from "react";
import { Linking, Platform, StyleSheet, View } from "react-native";
import { BACKUP_MAX_BYTES } from "../../knowledge/contracts/backup";
import { ApiError } from "../../hooks/api";
import { colors, radii, space } from "../../hooks/theme";
import { progressFraction, useBackupDownload, useImportBackupMutation, type BackupProgress } from "../../hooks/use-backup";
import { caseExportUrl } from "../../hooks/use-cases";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import type { DeskSectionProps } from "./desk-sections";

const WEB = Platform.OS === "web";

function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}

/** A bar for long work; without a known total it says how much has arrived. */
function ProgressBar({ fraction, label, testID }: { fraction: number | null; label: string; testID?: string }) {
  return (
    <View
      accessible
      accessibilityRole="progressbar"
      accessibilityLabel={label}
      accessibilityValue={fraction === null ? undefined : { min: 0, max: 100, now: Math.round(fraction * 100) }}
      style={styles.progress}
      testID={testID}
    >
      <View style={styles.track}>
        <View style={[styles.fill, { width: `${Math.round((fraction ?? 0) * 100)}%` }]} />
      </View>
      <Text size="label">{label}</Text>
    </View>
  );
}

function progressLabel(p: BackupProgress): string {
  const f = progressFraction(p);
  return f === null ? `${formatBytes(p.bytes)} received` : `${p.records} of ${p.total} records · ${Math.round(f * 100)} % · ${formatBytes(p.bytes)}`;
}

/** Opens the browser's file picker for one JSON file. */
function pickFile(onPick: (file: File) => void): void {
  const input = document.createElement("input");
  input.type = "file";
  input.accept = "application/json,.json";
  input.onchange = () => {
    const file = input.files?.[0];
    if (file) onPick(file);
  };
  input.click();
}

function Download({ canAct }: { canAct: boolean }) {
  const { state, start, stop } = useBackupDownload();
  return (
    <Card testID="backup-download">
      <Text size="title" bold>
        Download a backup
      </Text>
      <Text>
        One JSON file with everything the group has recorded: cases, attempts, photo records (the photo files stay on the server), requests, advice notes,
        reference corrections and the audit log. People appear by name and e-mail.
      </Text>
      {!canAct ? (
        <Text tone="inkMuted">Leads and owners download backups.</Text>
      ) : !WEB ? (
        <Text tone="inkMuted">Open Phasewise in a browser to save a backup file.</Text>
      ) : (
        <View style={styles.buttons}>
          <Button label="Download backup" busy={state.phase === "downloading"} onPress={start} testID="backup-start" />
          {state.phase === "downloading" ? <Button label="Stop" variant="quiet" onPress={stop} /> : null}
        </View>
      )}
      {state.phase === "downloading" ? <ProgressBar fraction={progressFraction(state.progress)} label={progressLabel(state.progress)} testID="backup-progress" /> : null}
      {state.phase === "done" ? (
        <Notice tone="good" title="Backup saved" testID="backup-done">
          <Text>{state.fileName}: {state.progress.total ?? state.progress.records} records, {formatBytes(state.progress.bytes)}. Keep it somewhere safe; it holds people&apos;s e-mail addresses.</Text>
        </Notice>
      ) : null}
      {state.phase === "error" ? (
        <Notice tone="danger" title="The backup did not finish" testID="backup-error">
          <Text>{state.error.message} Nothing partial was saved; try again.</Text>
        </Notice>
      ) : null}
    </Card>
  );
}

function Import({ groupName, canAct }: { groupName: string; canAct: boolean }) {
  const [file, setFile] = useState<File | null>(null);
  const imp = useImportBackupMutation();
  const err = imp.error instanceof ApiError ? imp.error : null;
  const tooBig = file !== null && file.size > BACKUP_MAX_BYTES;
  if (!canAct || !WEB) return null;
  return (
    <Card testID="backup-import">
      <Text size="title" bold>
        Bring a backup into this group
      </Text>
      <Text>
        Only into an empty group: start a new group, make it the active one, then import. Every record gets a new id; people are matched to this group&apos;s
        members by e-mail, and anyone else&apos;s work is credited to you.
      </Text>
      <View style={styles.buttons}>
        <Button label={file ? "Choose another file" : "Choose a backup file"} variant="secondary" onPress={() => pickFile(setFile)} testID="backup-choose" />
        {file ? (
          <Button
            label={`Import into ${groupName}`}
            disabled={tooBig}
            busy={imp.isPending}
            onPress={() => imp.mutate(file)}
            testID="backup-import-start"
          />
        ) : null}
      </View>
      {file ? (
        <Text size="label" tone={tooBig ? "danger" : "inkMuted"}>
          {file.name} · {formatBytes(file.size)}
          {tooBig ? ` · larger than the ${formatBytes(BACKUP_MAX_BYTES)} an import takes` : ""}
        </Text>
      ) : null}
      {imp.isPending ? <ProgressBar fraction={imp.sent} label={`${Math.round(imp.sent * 100)} % sent${imp.sent >= 1 ? " · writing the records" : ""}`} /> : null}
      {imp.isSuccess ? (
        <Notice tone="good" title="Imported" testID="backup-imported">
          <Text>{imp.data.imported.cases} cases, {imp.data.imported.attempts} attempts, {imp.data.imported.photos} photos, {imp.data.imported.advice} notes,{" "}
          {imp.data.imported.overrides} corrections, {imp.data.imported.audit} log entries. {imp.data.peopleMatched} people matched by e-mail,{" "}
          {imp.data.peopleToImporter} credited to you.
          {imp.data.photosMissing ? ` ${imp.data.photosMissing} photos were left out: their files are not on this server.` : ""}</Text>
        </Notice>
      ) : null}
      {err ? (
        <Notice tone="danger" title="Not imported" testID="backup-import-error">
          <Text>{err.message} Nothing was written.</Text>
        </Notice>
      ) : null}
    </Card>
  );
}

/** Desk › Backup: the whole group as one file, cases as CSV, and a backup brought into an empty group. */
export function BackupSection({ group, canAct }: DeskSectionProps) {
  const csv = caseExportUrl({});
  return (
    <View style={styles.section}>
      <Download canAct={canAct} />
      <Card>
        <Text size="title" bold>
          Cases as a spreadsheet
        </Text>
        <Text>Every live case as CSV, one row per case, with what worked. The case list exports its filtered view the same way.</Text>
        <View style={styles.buttons}>
          <Button label="Download cases (CSV)" variant="secondary" onPress={() => void Linking.openURL(csv)} testID="backup-csv" />
        </View>
      </Card>
      <Import groupName={group.name} canAct={canAct} />
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.lg },
  buttons: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  progress: { gap: space.xs },
  track: { height: 14, borderRadius: radii.pill, backgroundColor: colors.paper, borderWidth: 1, borderColor: colors.line, overflow: "hidden" },
  fill: { height: "100%", backgroundColor: colors.brand },
});
