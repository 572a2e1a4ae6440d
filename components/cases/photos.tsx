import * as ImagePicker from "expo-image-picker";
import { useEffect, useRef, useState } from "react";
import { Image, Modal, Platform, Pressable, StyleSheet, View } from "react-native";
import { apiUrl } from "../../hooks/api";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useDeletePhotoMutation, useUploadPhotoMutation, type UploadFile } from "../../hooks/use-cases";
import { MAX_PHOTO_BYTES, PHOTO_MIME_TYPES, type CasePhoto } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";

/** A photo picked on this device, not yet uploaded. */
export interface PickedPhoto {
  /** local id for lists */
  key: string;
  /** a blob: or file: URI to preview */
  previewUri: string;
  file: UploadFile;
  sizeBytes: number | null;
  mimeType: string | null;
}

let pickCounter = 0;

/** Refuse what the server would refuse, before spending the upload. */
export function photoProblem(p: Pick<PickedPhoto, "sizeBytes" | "mimeType">): string | null {
  if (p.sizeBytes !== null && p.sizeBytes > MAX_PHOTO_BYTES) {
    return `That photo is ${(p.sizeBytes / 1024 / 1024).toFixed(1)} MB; the limit is ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`;
  }
  if (p.mimeType && !(PHOTO_MIME_TYPES as readonly string[]).includes(p.mimeType)) {
    return "Photos must be JPEG, PNG or WebP. On a phone set the camera to \"most compatible\" or pick the photo again.";
  }
  return null;
}

/** Camera or library through expo-image-picker (on the web: a file input, which can open the camera). */
export async function pickPhoto(source: "camera" | "library"): Promise<PickedPhoto | { error: string } | null> {
  if (Platform.OS !== "web") {
    const perm = source === "camera" ? await ImagePicker.requestCameraPermissionsAsync() : await ImagePicker.requestMediaLibraryPermissionsAsync();
    if (!perm.granted) return { error: source === "camera" ? "Phasewise may not use the camera: allow it in the phone's settings." : "Phasewise may not read your photos: allow it in the phone's settings." };
  }
  const options: ImagePicker.ImagePickerOptions = { mediaTypes: ["images"], quality: 0.85, allowsMultipleSelection: false };
  const result = source === "camera" ? await ImagePicker.launchCameraAsync(options) : await ImagePicker.launchImageLibraryAsync(options);
  const asset = result.canceled ? undefined : result.assets?.[0];
  if (!asset) return null;
  const name = asset.fileName ?? `photo-${Date.now()}.jpg`;
  const mimeType = asset.mimeType ?? asset.file?.type ?? null;
  const file: UploadFile = asset.file ? { blob: asset.file, name } : { uri: asset.uri, name, type: mimeType ?? "image/jpeg" };
  pickCounter += 1;
  return { key: `picked-${pickCounter}`, previewUri: asset.uri, file, sizeBytes: asset.fileSize ?? asset.file?.size ?? null, mimeType };
}

export function PickButtons({ onPicked, onError, disabled }: { onPicked: (p: PickedPhoto) => void; onError: (m: string) => void; disabled?: boolean }) {
  const pick = async (source: "camera" | "library") => {
    try {
      const r = await pickPhoto(source);
      if (!r) return;
      if ("error" in r) onError(r.error);
      else {
        const problem = photoProblem(r);
        if (problem) onError(problem);
        else onPicked(r);
      }
    } catch (e) {
      onError(e instanceof Error ? e.message : "That photo could not be read.");
    }
  };
  return (
    <View style={styles.pickRow}>
      <Button label="Take a photo" variant="secondary" disabled={disabled} onPress={() => pick("camera")} testID="photo-take" grow />
      <Button label="Choose a photo" variant="secondary" disabled={disabled} onPress={() => pick("library")} testID="photo-library" grow />
    </View>
  );
}

export function ProgressBar({ fraction, label, testID }: { fraction: number; label: string; testID?: string }) {
  const pct = Math.round(Math.min(Math.max(fraction, 0), 1) * 100);
  return (
    <View style={styles.progressWrap} testID={testID} accessibilityRole="progressbar" accessibilityLabel={label} accessibilityValue={{ min: 0, max: 100, now: pct }}>
      <View style={styles.progressTrack}>
        <View style={[styles.progressFill, { width: `${pct}%` }]} />
      </View>
      <Text size="caption" tone="inkMuted">
        {label} · {pct} %
      </Text>
    </View>
  );
}

/**
 * One picked photo on its way to a case: starts uploading when `caseId` is known, shows
 * its progress, and offers a retry on failure. Owns its own mutation.
 */
export function UploadRow({ photo, caseId, onDone, onRemove }: { photo: PickedPhoto; caseId: string | null; onDone: (p: PickedPhoto, uploaded: CasePhoto) => void; onRemove: (p: PickedPhoto) => void }) {
  const upload = useUploadPhotoMutation(caseId ?? "");
  const started = useRef(false);
  const start = () => {
    if (!caseId) return;
    started.current = true;
    upload.mutate(photo.file, { onSuccess: (res) => onDone(photo, res) });
  };
  useEffect(() => {
    if (caseId && !started.current) start();
    // Start once per row when the case exists; retries go through the button.
  }, [caseId]);
  return (
    <View style={styles.uploadRow} testID={`upload-${photo.key}`}>
      <Image source={{ uri: photo.previewUri }} style={styles.uploadThumb} accessibilityLabel="Photo to upload" />
      <View style={styles.uploadBody}>
        {upload.isError ? (
          <>
            <Text tone="danger" size="label">
              {upload.error instanceof Error ? upload.error.message : "The upload failed."}
            </Text>
            <View style={styles.pickRow}>
              <Button label="Try again" variant="secondary" onPress={start} testID="upload-retry" />
              <Button label="Leave it out" variant="quiet" onPress={() => onRemove(photo)} />
            </View>
          </>
        ) : upload.progress !== null ? (
          <ProgressBar fraction={upload.progress} label={upload.isSuccess ? "Uploaded" : "Uploading"} testID="upload-progress" />
        ) : (
          <View style={styles.pickRow}>
            <Text tone="inkMuted" size="label">
              Uploads when the case is saved
            </Text>
            <Button label="Remove" variant="quiet" onPress={() => onRemove(photo)} testID="upload-remove" />
          </View>
        )}
      </View>
    </View>
  );
}

export function photoSrc(url: string): string {
  return url.startsWith("/") ? apiUrl(url) : url;
}

/** Thumbnails of a case's photos; a tap opens the full photo. */
export function PhotoGrid({ caseId, photos, canDelete }: { caseId: string; photos: CasePhoto[]; canDelete: boolean }) {
  const [open, setOpen] = useState<CasePhoto | null>(null);
  const del = useDeletePhotoMutation(caseId);
  return (
    <>
      <View style={styles.grid}>
        {photos.map((p, i) => (
          <Pressable
            key={p.id}
            onPress={() => setOpen(p)}
            accessibilityRole="imagebutton"
            accessibilityLabel={`Photo ${i + 1} of ${photos.length}, open full size`}
            testID={`photo-thumb-${i}`}
            style={styles.thumbButton}
          >
            <Image source={{ uri: photoSrc(p.thumbnailUrl) }} style={styles.thumb} resizeMode="cover" />
          </Pressable>
        ))}
      </View>
      <Modal visible={!!open} transparent animationType="fade" onRequestClose={() => setOpen(null)}>
        <View style={styles.viewer} testID="photo-full">
          {open ? (
            <Image
              source={{ uri: photoSrc(open.url) }}
              style={styles.full}
              resizeMode="contain"
              accessibilityLabel={`Photo, ${open.width} × ${open.height} pixels`}
            />
          ) : null}
          {del.isError ? (
            <Notice tone="danger">{del.error instanceof Error ? del.error.message : "The photo was not deleted."}</Notice>
          ) : null}
          <View style={styles.viewerBar}>
            {canDelete && open ? (
              <Button
                label="Delete photo"
                variant="danger"
                busy={del.isPending}
                onPress={() => del.mutate(open.id, { onSuccess: () => setOpen(null) })}
                testID="photo-delete"
              />
            ) : null}
            <Button label="Close" onPress={() => setOpen(null)} testID="photo-close" />
          </View>
        </View>
      </Modal>
    </>
  );
}

const styles = StyleSheet.create({
  pickRow: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  progressWrap: { gap: space.xs, flexGrow: 1 },
  progressTrack: { height: 12, borderRadius: radii.pill, backgroundColor: colors.line, overflow: "hidden" },
  progressFill: { height: 12, backgroundColor: colors.good },
  uploadRow: { flexDirection: "row", gap: space.md, alignItems: "center" },
  uploadThumb: { width: 64, height: 64, borderRadius: radii.sm, backgroundColor: colors.line },
  uploadBody: { flex: 1, gap: space.xs },
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  thumbButton: { width: 104, height: 104, minWidth: TOUCH_MIN, borderRadius: radii.md, overflow: "hidden", borderWidth: 1, borderColor: colors.line },
  thumb: { width: "100%", height: "100%", backgroundColor: colors.line },
  viewer: { flex: 1, backgroundColor: colors.ink, padding: space.lg, gap: space.md, justifyContent: "center" },
  full: { flex: 1, width: "100%" },
  viewerBar: { flexDirection: "row", justifyContent: "flex-end", gap: space.sm, flexWrap: "wrap" },
});
