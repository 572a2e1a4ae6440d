import { Router, type RequestHandler } from "express";
import { and, count, eq } from "drizzle-orm";
import { fileTypeFromBuffer } from "file-type";
import multer from "multer";
import sharp from "sharp";
import { z } from "zod";
import { MAX_PHOTOS_PER_CASE, MAX_PHOTO_BYTES, PHOTO_MIME_TYPES } from "../../knowledge/contracts/cases";
import { casePhotos, cases, member } from "../../db/schema";
import { toPhoto } from "../case-records";
import type { AppDeps } from "../deps";
import { HttpError, badRequest, forbidden, notFound } from "../middleware/errors";
import { requireGroup, requireUser } from "../middleware/session";
import { parse } from "../middleware/validate";
import { newStorageKey, type Storage } from "../storage";
import { canEditCase, caseInGroup } from "./cases";

const idParam = z.string().min(1).max(100);

/**
 * Refuse decoded images above 40 megapixels before sharp allocates them: a 10 MB file can
 * declare a gigapixel canvas ("decompression bomb"). Phone cameras top out near 50 MP only in
 * special modes; 12–24 MP is usual.
 */
export const MAX_INPUT_PIXELS = 40_000_000;
/** Stored photos are scaled down to fit this box (plenty for a funnel at full screen). */
export const MAX_STORED_EDGE_PX = 2560;
export const THUMBNAIL_EDGE_PX = 320;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 5, parts: 6 },
});

/** One file in field `photo`; other field names are a 400, not a silent drop. */
const receivePhoto: RequestHandler = (req, res, next) => {
  upload.single("photo")(req, res, (err: unknown) => {
    if ((err as { code?: string })?.code === "LIMIT_UNEXPECTED_FILE") {
      next(badRequest("Send the photo in the form field named photo.", { photo: "Send the photo in the form field named photo." }));
      return;
    }
    // busboy's own errors (truncated form, no boundary, bad part header) are the sender's fault.
    if (err && !(err instanceof multer.MulterError)) {
      next(badRequest("The upload is not a readable multipart form.", { photo: "Send the photo as a multipart form upload." }));
      return;
    }
    next(err);
  });
};

interface Processed {
  image: { bytes: Buffer; mime: string; width: number; height: number };
  thumbnail: { bytes: Buffer; mime: string };
}

/**
 * Re-encodes the photo: `.rotate()` applies the EXIF orientation to the pixels, and writing
 * without `withMetadata` drops every tag (EXIF, GPS location, camera serials, XMP).
 */
export async function processPhoto(bytes: Buffer, mime: string): Promise<Processed> {
  const input = () => sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS, failOn: "error" });
  try {
    const base = input().rotate().resize({ width: MAX_STORED_EDGE_PX, height: MAX_STORED_EDGE_PX, fit: "inside", withoutEnlargement: true });
    const encoded =
      mime === "image/png"
        ? base.png({ compressionLevel: 9 })
        : mime === "image/webp"
          ? base.webp({ quality: 82 })
          : base.jpeg({ quality: 85, mozjpeg: true });
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
    const thumb = await input()
      .rotate()
      .resize({ width: THUMBNAIL_EDGE_PX, height: THUMBNAIL_EDGE_PX, fit: "inside", withoutEnlargement: true })
      .webp({ quality: 70 })
      .toBuffer();
    return { image: { bytes: data, mime, width: info.width, height: info.height }, thumbnail: { bytes: thumb, mime: "image/webp" } };
  } catch (err) {
    const message = (err as Error).message ?? "";
    if (/pixel limit/i.test(message)) {
      throw new HttpError(413, "too_many_pixels", `That image is larger than ${MAX_INPUT_PIXELS / 1_000_000} megapixels.`);
    }
    throw badRequest("That image could not be read. Try another photo.", { photo: "The image data is damaged or incomplete." });
  }
}

/** Checks the file by its bytes (never its name or the browser's claim) against the allow-list. */
async function sniff(bytes: Buffer): Promise<string> {
  const type = await fileTypeFromBuffer(bytes);
  if (type && (PHOTO_MIME_TYPES as readonly string[]).includes(type.mime)) return type.mime;
  // HEIC (HEVC-coded) photos: the sharp build here decodes only AV1-coded HEIF, so say what to do.
  if (type && (type.mime === "image/heic" || type.mime === "image/heif" || type.mime === "image/heic-sequence")) {
    throw new HttpError(415, "unsupported_type", "HEIC photos are not accepted yet. Choose JPEG (“Most Compatible” on the phone's camera) or PNG.");
  }
  throw new HttpError(415, "unsupported_type", "Only JPEG, PNG or WebP photos are accepted.");
}

async function removeQuietly(storage: Storage, keys: string[]): Promise<void> {
  await Promise.all(keys.map((k) => storage.delete(k).catch((err) => console.error(`Could not remove stored file ${k}:`, err))));
}

export function photosRouter({ db, storage }: AppDeps): Router {
  const router = Router();
  const inGroup = requireGroup(db);

  router.post("/cases/:id/photos", inGroup, async (req, _res, next) => {
    // Refuse before reading a 10 MB body for a case the caller may not change.
    const row = await caseInGroup(db, req.group!.id, parse(idParam, req.params.id));
    if (!canEditCase(req.group!, req.user!.id, row.authorId)) throw forbidden("Only the case's author or a lead can add photos.");
    next();
  }, receivePhoto, async (req, res) => {
    const file = req.file;
    if (!file) throw badRequest("Attach a photo in the field named photo.", { photo: "Attach a photo." });
    const mime = await sniff(file.buffer);
    const caseId = parse(idParam, req.params.id);
    const limitError = () =>
      new HttpError(409, "photo_limit", `A case holds at most ${MAX_PHOTOS_PER_CASE} photos. Delete one to add another.`);
    const [existing] = await db.select({ n: count() }).from(casePhotos).where(eq(casePhotos.caseId, caseId));
    if (Number(existing?.n ?? 0) >= MAX_PHOTOS_PER_CASE) throw limitError();

    const processed = await processPhoto(file.buffer, mime);
    const imageKey = newStorageKey("photos", processed.image.mime);
    const thumbKey = newStorageKey("photos", processed.thumbnail.mime, "thumb");
    const written: string[] = [];
    try {
      // Files first, then the row in a transaction; on any failure the files go again.
      await storage.put(imageKey, processed.image.bytes, processed.image.mime);
      written.push(imageKey);
      await storage.put(thumbKey, processed.thumbnail.bytes, processed.thumbnail.mime);
      written.push(thumbKey);
      const photo = await db.transaction(async (tx) => {
        const locked = await caseInGroup(tx, req.group!.id, caseId, true);
        const [n] = await tx.select({ n: count() }).from(casePhotos).where(eq(casePhotos.caseId, locked.id));
        if (Number(n?.n ?? 0) >= MAX_PHOTOS_PER_CASE) throw limitError();
        const [inserted] = await tx
          .insert(casePhotos)
          .values({
            id: crypto.randomUUID(),
            caseId: locked.id,
            groupId: locked.groupId,
            storageKey: imageKey,
            thumbnailKey: thumbKey,
            mimeType: processed.image.mime,
            sizeBytes: processed.image.bytes.length,
            width: processed.image.width,
            height: processed.image.height,
            thumbnailSizeBytes: processed.thumbnail.bytes.length,
            uploadedBy: req.user!.id,
            createdAt: new Date(),
          })
          .returning();
        await tx.update(cases).set({ updatedAt: new Date() }).where(eq(cases.id, locked.id));
        return inserted!;
      });
      res.status(201).json(toPhoto(photo));
    } catch (err) {
      await removeQuietly(storage, written);
      throw err;
    }
  });

  /** The photo if the caller belongs to its group (any of their groups); otherwise it does not exist. */
  async function visiblePhoto(userId: string, photoId: string) {
    const rows = await db
      .select({ photo: casePhotos })
      .from(casePhotos)
      .innerJoin(member, and(eq(member.organizationId, casePhotos.groupId), eq(member.userId, userId)))
      .where(eq(casePhotos.id, photoId))
      .limit(1);
    const row = rows[0];
    if (!row) throw notFound("That photo");
    return row.photo;
  }

  for (const variant of ["image", "thumbnail"] as const) {
    router.get(variant === "image" ? "/photos/:id" : "/photos/:id/thumbnail", requireUser, async (req, res) => {
      const photo = await visiblePhoto(req.user!.id, parse(idParam, req.params.id));
      const stored = await storage.get(variant === "image" ? photo.storageKey : photo.thumbnailKey);
      if (!stored) throw notFound("That photo");
      res.setHeader("Content-Type", variant === "image" ? photo.mimeType : "image/webp");
      res.setHeader("Cache-Control", "private, max-age=86400");
      res.setHeader("Content-Disposition", "inline");
      res.send(stored.bytes);
    });
  }

  router.delete("/photos/:id", inGroup, async (req, res) => {
    const photoId = parse(idParam, req.params.id);
    const keys = await db.transaction(async (tx) => {
      const [photo] = await tx
        .select()
        .from(casePhotos)
        .where(and(eq(casePhotos.id, photoId), eq(casePhotos.groupId, req.group!.id)));
      if (!photo) throw notFound("That photo");
      const row = await caseInGroup(tx, req.group!.id, photo.caseId, true);
      if (!canEditCase(req.group!, req.user!.id, row.authorId) && photo.uploadedBy !== req.user!.id) {
        throw forbidden("Only the case's author, the uploader or a lead can delete a photo.");
      }
      await tx.delete(casePhotos).where(eq(casePhotos.id, photo.id));
      await tx.update(cases).set({ updatedAt: new Date() }).where(eq(cases.id, row.id));
      return [photo.storageKey, photo.thumbnailKey];
    });
    // The row is gone first: a file left behind by a failed delete is harmless, a row without its file is not.
    await removeQuietly(storage, keys);
    res.status(204).end();
  });

  return router;
}
