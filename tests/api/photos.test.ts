import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";
import { Readable } from "node:stream";
import { S3Client } from "@aws-sdk/client-s3";
import { sql } from "drizzle-orm";
import sharp from "sharp";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";
import { createLocalStorage, createS3Storage, newStorageKey, type S3Send, type Storage } from "../../server/storage";
import { agentFor, ORIGIN, groupWithRoles, signUp, startTestApp, type TestApp } from "./harness";
import { createCase } from "./case-helpers";

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "photo");
  b = await groupWithRoles(t, "outsider");
});
afterAll(async () => {
  await t.close();
});

const photoDir = () => path.join(t.deps.dataDir, "photos");
function storedFiles(dir = photoDir()): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}
async function photoRows(caseId: string): Promise<number> {
  const r = await t.db.execute(sql`select count(*)::int as n from case_photos where case_id = ${caseId}`);
  return (r as unknown as { rows: { n: number }[] }).rows[0]!.n;
}

/** Tag numbers of EXIF IFD0 and of its GPS IFD (pointer tag 0x8825), read straight from the TIFF structure (EXIF 2.3 §4.6). */
function exifTags(exif: Buffer): { ifd0: number[]; gps: number[] } {
  const tiff = exif.subarray(0, 6).toString("latin1") === "Exif\0\0" ? exif.subarray(6) : exif;
  const le = tiff.toString("latin1", 0, 2) === "II";
  const u16 = (p: number) => (le ? tiff.readUInt16LE(p) : tiff.readUInt16BE(p));
  const u32 = (p: number) => (le ? tiff.readUInt32LE(p) : tiff.readUInt32BE(p));
  const entries = (offset: number) => Array.from({ length: u16(offset) }, (_, i) => offset + 2 + i * 12);
  const ifd0 = entries(u32(4));
  const gpsEntry = ifd0.find((e) => u16(e) === 0x8825);
  return { ifd0: ifd0.map(u16), gps: gpsEntry === undefined ? [] : entries(u32(gpsEntry + 8)).map(u16) };
}

/** 40 × 20 px: left half red, right half blue; EXIF orientation 6 ("rotate 90° clockwise to view") and a GPS position. */
async function phonePhoto(): Promise<Buffer> {
  const red = await sharp({ create: { width: 20, height: 20, channels: 3, background: "#ff0000" } }).png().toBuffer();
  const blue = await sharp({ create: { width: 20, height: 20, channels: 3, background: "#0000ff" } }).png().toBuffer();
  return sharp({ create: { width: 40, height: 20, channels: 3, background: "#000000" } })
    .composite([
      { input: red, left: 0, top: 0 },
      { input: blue, left: 20, top: 0 },
    ])
    .jpeg({ quality: 95 })
    .withMetadata({ orientation: 6 })
    .withExifMerge({ IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" } })
    .toBuffer();
}

async function smallPng(shade = 128): Promise<Buffer> {
  return sharp({ create: { width: 16, height: 12, channels: 3, background: { r: shade, g: shade, b: shade } } }).png().toBuffer();
}

async function pixel(image: Buffer, x: number, y: number): Promise<[number, number, number]> {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return [data[i]!, data[i + 1]!, data[i + 2]!];
}

describe("POST /api/cases/:id/photos", () => {
  it("stores a re-encoded copy: orientation applied, EXIF and GPS gone, thumbnail made", async () => {
    const original = await phonePhoto();
    // The fixture really carries what must be removed.
    const before = await sharp(original).metadata();
    expect(before.orientation).toBe(6);
    expect(exifTags(before.exif!).gps).toEqual(expect.arrayContaining([1, 2, 3, 4]));

    const c = await createCase(a.chemist.agent);
    const res = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", original, { filename: "IMG_0042.jpg", contentType: "image/jpeg" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ caseId: c.id, mimeType: "image/jpeg", width: 20, height: 40, url: `/api/photos/${res.body.id}` });

    const got = await a.chemist.agent.get(res.body.url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (d: Buffer) => chunks.push(d));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(got.status).toBe(200);
    expect(got.headers["content-type"]).toBe("image/jpeg");
    const stored = got.body as Buffer;
    const after = await sharp(stored).metadata();
    expect(after.exif).toBeUndefined();
    expect(after.orientation).toBeUndefined();
    expect([after.width, after.height]).toEqual([20, 40]);
    // Turned 90° clockwise, the left (red) half is now on top and the right (blue) half below.
    const top = await pixel(stored, 10, 8);
    const bottom = await pixel(stored, 10, 32);
    expect(top[0]).toBeGreaterThan(200);
    expect(top[2]).toBeLessThan(60);
    expect(bottom[2]).toBeGreaterThan(200);
    expect(bottom[0]).toBeLessThan(60);
    // The original filename is never a path: only random keys are on disk.
    expect(storedFiles().some((f) => f.includes("IMG_0042"))).toBe(false);

    const thumb = await a.lead.agent.get(res.body.thumbnailUrl).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (d: Buffer) => chunks.push(d));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    expect(thumb.status).toBe(200);
    const tm = await sharp(thumb.body as Buffer).metadata();
    expect(tm.format).toBe("webp");
    expect(tm.exif).toBeUndefined();

    const detail = (await a.chemist.agent.get(`/api/cases/${c.id}`)).body;
    expect(detail.photos.map((p: { id: string }) => p.id)).toEqual([res.body.id]);
    expect(detail.photoCount).toBe(1);
    expect(detail.thumbnailUrl).toBe(res.body.thumbnailUrl);
  });

  it("refuses a text file renamed .jpg (415) and leaves nothing behind", async () => {
    const c = await createCase(a.chemist.agent);
    const filesBefore = storedFiles().length;
    const res = await a.chemist.agent
      .post(`/api/cases/${c.id}/photos`)
      .attach("photo", Buffer.from("these are my notes, not a photo\n"), { filename: "funnel.jpg", contentType: "image/jpeg" });
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe("unsupported_type");
    expect(await photoRows(c.id)).toBe(0);
    expect(storedFiles().length).toBe(filesBefore);
  });

  it("refuses HEIC with a way out (the sharp build here has no HEVC decoder)", async () => {
    // An ISO-BMFF "ftyp" box with the brand "heic" is what identifies a HEIC file (ISO/IEC 23008-12).
    const ftyp = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from("ftypheic"), Buffer.from([0, 0, 0, 0]), Buffer.from("mif1heic")]);
    const c = await createCase(a.chemist.agent);
    const res = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", Buffer.concat([ftyp, Buffer.alloc(64)]), { filename: "x.heic" });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/HEIC/);
  });

  it("answers 413 above 10 MB", async () => {
    const c = await createCase(a.chemist.agent);
    const big = Buffer.concat([await smallPng(), Buffer.alloc(10 * 1024 * 1024)]);
    const res = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", big, { filename: "big.png" });
    expect(res.status).toBe(413);
    expect(await photoRows(c.id)).toBe(0);
  });

  it("refuses a decompression bomb: a small file declaring 50 megapixels", async () => {
    // A real 10 × 5 PNG whose IHDR is rewritten to claim 10 000 × 5 000 px (PNG spec §11.2.2: width and
    // height at bytes 16–23, then the chunk's CRC-32 over type and data).
    const bomb = Buffer.from(await sharp({ create: { width: 10, height: 5, channels: 3, background: "#808080" } }).png().toBuffer());
    bomb.writeUInt32BE(10_000, 16);
    bomb.writeUInt32BE(5_000, 20);
    bomb.writeUInt32BE(zlib.crc32(bomb.subarray(12, 29)), 29);
    expect((await sharp(bomb, { limitInputPixels: false }).metadata()).width).toBe(10_000);
    const c = await createCase(a.chemist.agent);
    const res = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", bomb, { filename: "bomb.png" });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("too_many_pixels");
  });

  it("takes six photos and refuses the seventh (409)", async () => {
    const c = await createCase(a.chemist.agent);
    for (let i = 0; i < 6; i++) {
      const res = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", await smallPng(40 * i), { filename: `p${i}.png` });
      expect(res.status).toBe(201);
    }
    const filesBefore = storedFiles().length;
    const seventh = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("photo", await smallPng(), { filename: "p7.png" });
    expect(seventh.status).toBe(409);
    expect(seventh.body.error.code).toBe("photo_limit");
    expect(await photoRows(c.id)).toBe(6);
    expect(storedFiles().length).toBe(filesBefore);
  });

  it("answers 400 without a file or with the wrong field name", async () => {
    const c = await createCase(a.chemist.agent);
    expect((await a.chemist.agent.post(`/api/cases/${c.id}/photos`).field("note", "x")).status).toBe(400);
    const wrong = await a.chemist.agent.post(`/api/cases/${c.id}/photos`).attach("image", await smallPng(), { filename: "p.png" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty("photo");
    // A form cut off before its closing boundary.
    const truncated = await a.chemist.agent
      .post(`/api/cases/${c.id}/photos`)
      .set("Content-Type", "multipart/form-data; boundary=xyz")
      .send('--xyz\r\nContent-Disposition: form-data; name="photo"; filename="p.png"\r\nContent-Type: image/png\r\n\r\nnot finished');
    expect(truncated.status).toBe(400);
    expect(await photoRows(c.id)).toBe(0);
  });

  it("answers 401 without a session, 403 for a chemist on another's case, 404 across groups", async () => {
    const leadCase = await createCase(a.lead.agent);
    const png = await smallPng();
    expect((await agentFor(t.app).post(`/api/cases/${leadCase.id}/photos`).attach("photo", png, { filename: "p.png" })).status).toBe(401);
    expect((await a.chemist.agent.post(`/api/cases/${leadCase.id}/photos`).attach("photo", png, { filename: "p.png" })).status).toBe(403);
    expect((await b.owner.agent.post(`/api/cases/${leadCase.id}/photos`).attach("photo", png, { filename: "p.png" })).status).toBe(404);
    expect((await a.owner.agent.post(`/api/cases/${leadCase.id}/photos`).attach("photo", png, { filename: "p.png" })).status).toBe(201);
  });
});

describe("GET and DELETE /api/photos/:id", () => {
  let caseId: string;
  let photoId: string;
  beforeAll(async () => {
    caseId = (await createCase(a.lead.agent)).id;
    const res = await a.lead.agent.post(`/api/cases/${caseId}/photos`).attach("photo", await smallPng(), { filename: "p.png" });
    photoId = res.body.id;
  });

  it("serves a photo only to members of its group", async () => {
    expect((await a.chemist.agent.get(`/api/photos/${photoId}`)).status).toBe(200);
    expect((await b.owner.agent.get(`/api/photos/${photoId}`)).status).toBe(404);
    expect((await b.owner.agent.get(`/api/photos/${photoId}/thumbnail`)).status).toBe(404);
    expect((await agentFor(t.app).get(`/api/photos/${photoId}`)).status).toBe(401);
    expect((await a.chemist.agent.get("/api/photos/not-a-photo")).status).toBe(404);
  });

  it("lets the author or a lead delete, not another chemist nor another group; the files go too", async () => {
    expect((await a.chemist.agent.delete(`/api/photos/${photoId}`)).status).toBe(403);
    expect((await b.owner.agent.delete(`/api/photos/${photoId}`)).status).toBe(404);
    expect((await agentFor(t.app).delete(`/api/photos/${photoId}`)).status).toBe(401);
    const filesBefore = storedFiles().length;
    expect((await a.lead.agent.delete(`/api/photos/${photoId}`)).status).toBe(204);
    expect(storedFiles().length).toBe(filesBefore - 2);
    expect((await a.lead.agent.get(`/api/photos/${photoId}`)).status).toBe(404);
    expect(await photoRows(caseId)).toBe(0);
  });
});

/** A second app on the same database with another storage; its own accounts sign up through it. */
async function appWithStorage(storage: Storage) {
  const { app } = createApp({ db: t.db, dbKind: t.handle.kind, mail: createRecordingMailer(), baseURL: ORIGIN, rateLimit: { enabled: false }, quiet: true, storage });
  const owner = await signUp(app, "storage-owner");
  const made = await owner.agent.post("/api/groups").send({ name: "Storage lab" });
  expect(made.status).toBe(201);
  return { app, owner };
}

describe("no orphans when an upload fails", () => {
  it("removes the first file when storing the thumbnail fails", async () => {
    const dir = path.join(t.deps.dataDir, "failing");
    const local = createLocalStorage(dir);
    let puts = 0;
    const failing: Storage = {
      ...local,
      put: async (key, bytes, type) => {
        puts += 1;
        if (puts === 2) throw new Error("disk full");
        await local.put(key, bytes, type);
      },
    };
    const { owner } = await appWithStorage(failing);
    const c = await createCase(owner.agent);
    // The server logs the storage failure; keep the test output clean.
    const quiet = jest.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await owner.agent.post(`/api/cases/${c.id}/photos`).attach("photo", await smallPng(), { filename: "p.png" });
    quiet.mockRestore();
    expect(res.status).toBe(500);
    expect(puts).toBe(2);
    expect(storedFiles(dir)).toEqual([]);
    expect(await photoRows(c.id)).toBe(0);
  });

  it("removes both files when the database refuses the row (another upload took the last place)", async () => {
    const dir = path.join(t.deps.dataDir, "racing");
    const local = createLocalStorage(dir);
    let caseId = "";
    let raced = false;
    const racing: Storage = {
      ...local,
      put: async (key, bytes, type) => {
        await local.put(key, bytes, type);
        if (key.includes("-thumb") && !raced) {
          raced = true;
          // Between the pre-check and the transaction, six other photos land on the case.
          for (let i = 0; i < 6; i++) {
            await t.db.execute(sql`insert into case_photos (id, case_id, group_id, storage_key, thumbnail_key, mime_type, size_bytes, width, height, thumbnail_size_bytes, uploaded_by)
              select ${crypto.randomUUID()}, id, group_id, ${`elsewhere-${i}-${caseId}`}, ${`elsewhere-thumb-${i}-${caseId}`}, 'image/png', 1, 1, 1, 1, author_id from cases where id = ${caseId}`);
          }
        }
      },
    };
    const { owner } = await appWithStorage(racing);
    caseId = (await createCase(owner.agent)).id;
    const res = await owner.agent.post(`/api/cases/${caseId}/photos`).attach("photo", await smallPng(), { filename: "p.png" });
    expect(res.status).toBe(409);
    expect(raced).toBe(true);
    expect(storedFiles(dir)).toEqual([]);
    expect(await photoRows(caseId)).toBe(6);
  });
});

describe("S3-compatible storage", () => {
  /** An in-memory bucket behind the real S3Client: requests are signed, serialised and parsed by the SDK. */
  function fakeBucket() {
    const objects = new Map<string, { body: Buffer; type: string }>();
    const requests: { method: string; path: string; headers: Record<string, string> }[] = [];
    const client = new S3Client({
      region: "eu-west-2",
      endpoint: "http://objects.test:9000",
      forcePathStyle: true,
      credentials: { accessKeyId: "test-access", secretAccessKey: "test-secret" },
      requestHandler: {
        handle: async (request: { method: string; path: string; headers: Record<string, string>; body?: unknown }) => {
          requests.push({ method: request.method, path: request.path, headers: request.headers });
          const reply = (statusCode: number, headers: Record<string, string> = {}, body: Buffer = Buffer.alloc(0)) => ({
            response: { statusCode, headers, body: Readable.from([body]) },
          });
          if (request.method === "PUT") {
            const chunks: Buffer[] = [];
            const body = request.body as Buffer | Uint8Array | Readable;
            if (body instanceof Readable) for await (const c of body) chunks.push(Buffer.from(c));
            else chunks.push(Buffer.from(body as Uint8Array));
            objects.set(request.path, { body: Buffer.concat(chunks), type: request.headers["content-type"] ?? "" });
            return reply(200, { etag: '"1"' });
          }
          if (request.method === "GET") {
            const o = objects.get(request.path);
            if (!o) {
              const xml = Buffer.from('<?xml version="1.0"?><Error><Code>NoSuchKey</Code><Message>none</Message></Error>');
              return reply(404, { "content-type": "application/xml" }, xml);
            }
            return reply(200, { "content-type": o.type, "content-length": String(o.body.length) }, o.body);
          }
          if (request.method === "DELETE") {
            objects.delete(request.path);
            return reply(204);
          }
          return reply(405);
        },
      } as never,
    });
    const send: S3Send = (command) => client.send(command as never);
    return { objects, requests, send };
  }

  it("puts, gets and deletes objects by key, path-style and signed", async () => {
    const bucket = fakeBucket();
    const storage = createS3Storage({ bucket: "phasewise-photos", send: bucket.send });
    const key = newStorageKey("photos", "image/png");
    await storage.put(key, Buffer.from("png bytes"), "image/png");
    expect(bucket.requests[0]).toMatchObject({ method: "PUT", path: `/phasewise-photos/${key}` });
    expect(bucket.requests[0]!.headers.authorization).toMatch(/^AWS4-HMAC-SHA256 Credential=test-access\/\d{8}\/eu-west-2\/s3\/aws4_request/);
    expect(bucket.objects.get(`/phasewise-photos/${key}`)?.type).toBe("image/png");
    const got = await storage.get(key);
    expect(got?.bytes.toString()).toBe("png bytes");
    expect(got?.contentType).toBe("image/png");
    await storage.delete(key);
    expect(await storage.get(key)).toBeNull();
    await expect(storage.put("../../etc/passwd", Buffer.from("x"), "image/png")).rejects.toThrow(/Refusing/);
  });

  it("carries a whole upload and download through the app", async () => {
    const bucket = fakeBucket();
    const { owner } = await appWithStorage(createS3Storage({ bucket: "phasewise-photos", send: bucket.send }));
    const c = await createCase(owner.agent);
    const up = await owner.agent.post(`/api/cases/${c.id}/photos`).attach("photo", await phonePhoto(), { filename: "IMG_1.jpg" });
    expect(up.status).toBe(201);
    expect(bucket.objects.size).toBe(2);
    const down = await owner.agent.get(up.body.url);
    expect(down.status).toBe(200);
    expect(down.headers["content-type"]).toBe("image/jpeg");
    expect((await owner.agent.delete(`/api/photos/${up.body.id}`)).status).toBe(204);
    expect(bucket.objects.size).toBe(0);
  });
});

describe("storage keys", () => {
  it("are random and never carry a filename", () => {
    const keys = new Set(Array.from({ length: 200 }, () => newStorageKey("photos", "image/jpeg")));
    expect(keys.size).toBe(200);
    for (const k of keys) expect(k).toMatch(/^photos\/[0-9a-f]{2}\/[0-9a-f]{32}\.jpg$/);
  });
});
