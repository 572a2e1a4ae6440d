import { randomBytes } from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";

/** Where uploaded bytes live. Keys are ours (random); an original filename never becomes a path. */
export interface Storage {
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  /** null when nothing is stored under the key */
  get(key: string): Promise<StoredObject | null>;
  /** removing a missing key is not an error */
  delete(key: string): Promise<void>;
}

export interface StoredObject {
  bytes: Buffer;
  contentType: string;
}

const EXTENSIONS: Record<string, string> = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
};
const TYPES_BY_EXTENSION = Object.fromEntries(Object.entries(EXTENSIONS).map(([t, e]) => [e, t]));

/** Keys look like "photos/3f/3f9c…e1.webp": a random 128-bit name, fanned out by its first byte. */
const KEY_PATTERN = /^[a-z]+\/[0-9a-f]{2}\/[0-9a-f]{32}(-[a-z]+)?\.[a-z]+$/;

export function newStorageKey(prefix: string, contentType: string, suffix?: string): string {
  const ext = EXTENSIONS[contentType];
  if (!ext) throw new Error(`No storage extension for ${contentType}`);
  if (!/^[a-z]+$/.test(prefix) || (suffix !== undefined && !/^[a-z]+$/.test(suffix))) throw new Error("Bad key prefix or suffix");
  const name = randomBytes(16).toString("hex");
  return `${prefix}/${name.slice(0, 2)}/${name}${suffix ? `-${suffix}` : ""}.${ext}`;
}

function checkKey(key: string): void {
  // Defence in depth: only keys we generate are accepted, so nothing can climb out of the folder.
  if (!KEY_PATTERN.test(key)) throw new Error(`Refusing storage key ${JSON.stringify(key)}`);
}

/** Files under `root` (by default <dataDir>/photos). Writes go to a temporary name first, then rename. */
export function createLocalStorage(root: string): Storage {
  const base = path.resolve(root);
  const fileFor = (key: string) => {
    checkKey(key);
    return path.join(base, ...key.split("/"));
  };
  return {
    async put(key, bytes, contentType) {
      if (!EXTENSIONS[contentType]) throw new Error(`Unsupported content type ${contentType}`);
      const file = fileFor(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      const tmp = `${file}.${randomBytes(4).toString("hex")}.part`;
      await fs.writeFile(tmp, bytes);
      await fs.rename(tmp, file);
    },
    async get(key) {
      const file = fileFor(key);
      try {
        const bytes = await fs.readFile(file);
        const ext = path.extname(file).slice(1);
        return { bytes, contentType: TYPES_BY_EXTENSION[ext] ?? "application/octet-stream" };
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
        throw err;
      }
    },
    async delete(key) {
      await fs.rm(fileFor(key), { force: true });
    },
  };
}

/** The one S3Client method the driver uses; tests pass a recorded or fake one. */
export type S3Send = (command: PutObjectCommand | GetObjectCommand | DeleteObjectCommand) => Promise<unknown>;

interface GetOutput {
  Body?: { transformToByteArray(): Promise<Uint8Array> };
  ContentType?: string;
}

function isMissing(err: unknown): boolean {
  const e = err as { name?: string; Code?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === "NoSuchKey" || e?.Code === "NoSuchKey" || e?.name === "NotFound" || e?.$metadata?.httpStatusCode === 404;
}

/** An S3-compatible bucket (AWS, or a self-hosted service through `endpoint`). */
export function createS3Storage(options: { bucket: string; send: S3Send; prefix?: string }): Storage {
  const { bucket, send } = options;
  const prefix = options.prefix ?? "";
  const objectKey = (key: string) => {
    checkKey(key);
    return `${prefix}${key}`;
  };
  return {
    async put(key, bytes, contentType) {
      await send(new PutObjectCommand({ Bucket: bucket, Key: objectKey(key), Body: bytes, ContentType: contentType }));
    },
    async get(key) {
      try {
        const out = (await send(new GetObjectCommand({ Bucket: bucket, Key: objectKey(key) }))) as GetOutput;
        if (!out.Body) return null;
        const bytes = Buffer.from(await out.Body.transformToByteArray());
        return { bytes, contentType: out.ContentType ?? "application/octet-stream" };
      } catch (err) {
        if (isMissing(err)) return null;
        throw err;
      }
    },
    async delete(key) {
      await send(new DeleteObjectCommand({ Bucket: bucket, Key: objectKey(key) }));
    },
  };
}

export interface S3Settings {
  bucket: string;
  endpoint?: string;
  region: string;
  accessKey?: string;
  secretKey?: string;
}

/** A real S3Client for the settings; path-style addressing when an endpoint is given (self-hosted services expect it). */
export function s3ClientFor(settings: S3Settings): S3Client {
  return new S3Client({
    region: settings.region,
    endpoint: settings.endpoint,
    forcePathStyle: settings.endpoint !== undefined,
    credentials:
      settings.accessKey && settings.secretKey
        ? { accessKeyId: settings.accessKey, secretAccessKey: settings.secretKey }
        : undefined,
  });
}

export function createS3StorageFromSettings(settings: S3Settings): Storage {
  const client = s3ClientFor(settings);
  return createS3Storage({ bucket: settings.bucket, send: (command) => client.send(command as never) });
}
