import { useCallback, useRef, useState } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { BACKUP_MEDIA_TYPE, type ImportResponse } from "../knowledge/contracts/backup";
import { ApiError, apiUrl } from "./api";

/*
 * The group's backup through XMLHttpRequest, whose progress events fetch lacks: the download
 * counts records as they arrive (the server puts one per line and sends the total ahead), the
 * import reports bytes sent.
 */

export const BACKUP_RECORDS_HEADER = "X-Backup-Records";

export interface BackupProgress {
  /** records received so far */
  records: number;
  /** records the server said it would send; null until the headers arrive */
  total: number | null;
  bytes: number;
}

/** Record lines in `text` from `from` on: each record of a backup opens a line with "{". */
export function countRecordLines(text: string, from = 0): number {
  let n = 0;
  for (let i = text.indexOf("\n{", from); i >= 0; i = text.indexOf("\n{", i + 2)) n += 1;
  return n;
}

/** 0–1, or null while the total is unknown. */
export function progressFraction(p: BackupProgress): number | null {
  if (p.total === null) return null;
  if (p.total === 0) return 1;
  return Math.min(1, p.records / p.total);
}

function errorOf(xhr: XMLHttpRequest): ApiError {
  try {
    const body = JSON.parse(xhr.responseText) as { error?: { code?: string; message?: string; fields?: Record<string, string> } };
    return new ApiError(xhr.status, body.error?.code ?? "http_error", body.error?.message ?? `Request failed (${xhr.status}).`, body.error?.fields, body);
  } catch {
    return new ApiError(xhr.status, "http_error", xhr.status === 0 ? "The connection dropped. Try again." : `Request failed (${xhr.status}).`);
  }
}

function fileNameOf(xhr: XMLHttpRequest): string {
  const m = /filename="([^"]+)"/.exec(xhr.getResponseHeader("Content-Disposition") ?? "");
  return m?.[1] ?? "phasewise-backup.json";
}

/** Downloads the active group's backup, reporting progress; resolves with its text. */
export function fetchBackup(onProgress: (p: BackupProgress) => void, signal?: AbortSignal): Promise<{ text: string; fileName: string }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const progress: BackupProgress = { records: 0, total: null, bytes: 0 };
    let scanned = 0;
    xhr.open("GET", apiUrl("/api/backup"));
    xhr.withCredentials = true;
    xhr.onreadystatechange = () => {
      if (xhr.readyState === XMLHttpRequest.HEADERS_RECEIVED && xhr.status === 200) {
        const total = Number(xhr.getResponseHeader(BACKUP_RECORDS_HEADER));
        progress.total = Number.isFinite(total) ? total : null;
        onProgress({ ...progress });
      }
    };
    xhr.onprogress = (e) => {
      if (xhr.status !== 200) return;
      const text = xhr.responseText;
      // Scan only what is new, stepping back one character so a "\n{" split across chunks counts.
      progress.records += countRecordLines(text, Math.max(0, scanned - 1));
      scanned = text.length;
      progress.bytes = e.loaded;
      onProgress({ ...progress });
    };
    xhr.onload = () => {
      if (xhr.status !== 200) return reject(errorOf(xhr));
      onProgress({ ...progress, records: progress.total ?? progress.records, bytes: xhr.responseText.length });
      resolve({ text: xhr.responseText, fileName: fileNameOf(xhr) });
    };
    xhr.onerror = () => reject(errorOf(xhr));
    xhr.onabort = () => reject(new ApiError(0, "aborted", "The download was stopped."));
    signal?.addEventListener("abort", () => xhr.abort());
    xhr.send();
  });
}

/** Hands the text to the browser as a file download. */
export function saveTextFile(text: string, fileName: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: "application/json" }));
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Give the browser a moment to start the download before the blob goes.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export type DownloadState =
  | { phase: "idle" }
  | { phase: "downloading"; progress: BackupProgress }
  | { phase: "done"; fileName: string; progress: BackupProgress }
  | { phase: "error"; error: ApiError };

/** The "Download backup" button's state: start, progress, done or error; stop to abort. */
export function useBackupDownload(save: (text: string, fileName: string) => void = saveTextFile) {
  const [state, setState] = useState<DownloadState>({ phase: "idle" });
  const abort = useRef<AbortController | null>(null);
  const start = useCallback(async () => {
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    let last: BackupProgress = { records: 0, total: null, bytes: 0 };
    setState({ phase: "downloading", progress: last });
    try {
      const { text, fileName } = await fetchBackup((p) => {
        last = p;
        setState({ phase: "downloading", progress: p });
      }, controller.signal);
      save(text, fileName);
      setState({ phase: "done", fileName, progress: last });
    } catch (e) {
      setState({ phase: "error", error: e instanceof ApiError ? e : new ApiError(0, "failed", String(e)) });
    }
  }, [save]);
  const stop = useCallback(() => abort.current?.abort(), []);
  return { state, start, stop };
}

/** Sends a backup file to be imported into the active (empty) group, reporting the share sent. */
export function sendBackup(file: Blob, onProgress: (fraction: number) => void): Promise<ImportResponse> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", apiUrl("/api/backup/import"));
    xhr.withCredentials = true;
    xhr.setRequestHeader("Content-Type", BACKUP_MEDIA_TYPE);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => (xhr.status === 201 ? resolve(JSON.parse(xhr.responseText) as ImportResponse) : reject(errorOf(xhr)));
    xhr.onerror = () => reject(errorOf(xhr));
    xhr.send(file);
  });
}

/** An import fills the whole group: every query of it is stale afterwards. */
export function useImportBackupMutation() {
  const qc = useQueryClient();
  const [sent, setSent] = useState(0);
  const mutation = useMutation({
    mutationFn: (file: Blob) => {
      setSent(0);
      return sendBackup(file, setSent);
    },
    onSuccess: () => qc.invalidateQueries(),
  });
  return { ...mutation, sent };
}
