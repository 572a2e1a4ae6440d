import fs from "node:fs";
import path from "node:path";
import { sql } from "drizzle-orm";
import sharp from "sharp";
import { groupWithRoles, startTestApp, type TestApp } from "./harness";
import { createCase } from "./case-helpers";

/*
 * Hostile uploads to POST /api/cases/:id/photos: polyglots, truncated images, decompression
 * bombs in JPEG and WebP, declared types that lie, path-like file names. A refused upload leaves
 * no row and no file; an accepted one is a re-encoded image whose stored bytes carry nothing of
 * what was smuggled in. Byte layouts: JPEG SOF0 (ITU-T T.81 §B.2.2), PNG signature (PNG spec §5.2),
 * RIFF/WebP VP8X canvas size (WebP container spec).
 */

let t: TestApp;
let g: Awaited<ReturnType<typeof groupWithRoles>>;
beforeAll(async () => {
  t = await startTestApp();
  g = await groupWithRoles(t, "uploads");
});
afterAll(async () => {
  await t.close();
});

const photoDir = () => path.join(t.deps.dataDir, "photos");
function allFiles(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}
async function photoRowCount(): Promise<number> {
  const r = await t.db.execute(sql`select count(*)::int as n from case_photos`);
  return (r as unknown as { rows: { n: number }[] }).rows[0]!.n;
}

const jpeg = (w = 64, h = 48) => sharp({ create: { width: w, height: h, channels: 3 as const, background: "#3a6f8f" } }).jpeg().toBuffer();
const webp = (w = 64, h = 48) => sharp({ create: { width: w, height: h, channels: 3 as const, background: "#3a6f8f" } }).webp().toBuffer();
const png = (w = 64, h = 48) => sharp({ create: { width: w, height: h, channels: 3 as const, background: "#3a6f8f" } }).png().toBuffer();

async function upload(file: Buffer, filename: string, contentType?: string) {
  const c = await createCase(g.owner.agent);
  const rowsBefore = await photoRowCount();
  const filesBefore = allFiles(photoDir()).length;
  const res = await g.owner.agent.post(`/api/cases/${c.id}/photos`).attach("photo", file, { filename, ...(contentType ? { contentType } : {}) });
  return { res, caseId: c.id, rowsAdded: (await photoRowCount()) - rowsBefore, filesAdded: allFiles(photoDir()).length - filesBefore };
}

/** A refusal: a 4xx with our error shape, and nothing stored. */
function expectRefused(r: Awaited<ReturnType<typeof upload>>, status: number) {
  expect(r.res.status).toBe(status);
  expect(typeof r.res.body.error?.code).toBe("string");
  expect(r.rowsAdded).toBe(0);
  expect(r.filesAdded).toBe(0);
}

const SCRIPT = "<html><script>alert(document.cookie)</script></html>";

describe("polyglots", () => {
  it("refuses JPEG magic bytes in front of an HTML page (sniffed as JPEG, not decodable)", async () => {
    const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from(SCRIPT)]);
    expectRefused(await upload(fake, "funnel.jpg", "image/jpeg"), 400);
  });

  it("refuses a PNG signature in front of server-side code (no IHDR: not a PNG to the sniffer)", async () => {
    const fake = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.from("<?php system($_GET['c']); ?>")]);
    expectRefused(await upload(fake, "funnel.png", "image/png"), 415);
  });

  it("refuses a GIF carrying a zip archive (a type outside the allow-list)", async () => {
    const gifZip = Buffer.concat([Buffer.from("GIF89a"), Buffer.alloc(32), Buffer.from("PK\u0003\u0004"), Buffer.alloc(64)]);
    expectRefused(await upload(gifZip, "funnel.gif", "image/gif"), 415);
  });

  it("refuses an SVG with a script, whatever it is called", async () => {
    const svg = Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>`);
    expectRefused(await upload(svg, "funnel.png", "image/png"), 415);
  });

  it("keeps a real JPEG with a page appended, but stores only the re-encoded pixels and serves them as an image", async () => {
    const file = Buffer.concat([await jpeg(), Buffer.from(SCRIPT)]);
    const r = await upload(file, "funnel.jpg", "image/jpeg");
    expect(r.res.status).toBe(201);
    expect(r.rowsAdded).toBe(1);
    for (const f of allFiles(photoDir())) expect(fs.readFileSync(f).includes("<script>")).toBe(false);
    const served = await g.owner.agent.get(r.res.body.url).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => done(null, Buffer.concat(chunks)));
    });
    expect(served.status).toBe(200);
    expect(served.headers["content-type"]).toBe("image/jpeg");
    expect(served.headers["x-content-type-options"]).toBe("nosniff");
    expect((served.body as Buffer).includes("<script>")).toBe(false);
  });
});

describe("truncated images", () => {
  it.each([
    ["PNG", png, 0.5],
    ["WebP", webp, 0.5],
    ["JPEG header only", jpeg, 0.1],
  ] as const)("refuses a %s cut short", async (_name, make, keep) => {
    const whole = await make(320, 240);
    const cut = whole.subarray(0, Math.floor(whole.length * keep));
    expectRefused(await upload(cut, "cut.img"), 400);
  });
});

describe("decompression bombs (a pixel limit, not a byte limit)", () => {
  it("refuses a JPEG whose frame header claims 60 000 × 60 000 px", async () => {
    const bomb = Buffer.from(await jpeg(16, 16));
    // SOF0 marker FF C0, then length (2), precision (1), height (2), width (2): ITU-T T.81 §B.2.2.
    const sof = bomb.indexOf(Buffer.from([0xff, 0xc0]));
    expect(sof).toBeGreaterThan(0);
    bomb.writeUInt16BE(60_000, sof + 5);
    bomb.writeUInt16BE(60_000, sof + 7);
    expect((await sharp(bomb, { limitInputPixels: false }).metadata()).width).toBe(60_000);
    const r = await upload(bomb, "bomb.jpg");
    expectRefused(r, 413);
    expect(r.res.body.error.code).toBe("too_many_pixels");
  });

  it("refuses a WebP whose extended header claims a 16 384 × 16 384 canvas", async () => {
    // An extended WebP: RIFF, "WEBP", a VP8X chunk whose canvas width−1 and height−1 are 24-bit LE at offsets 24 and 27.
    const inner = Buffer.from(await webp(16, 16));
    const vp8 = inner.subarray(12);
    const vp8x = Buffer.alloc(18);
    vp8x.write("VP8X", 0, "latin1");
    vp8x.writeUInt32LE(10, 4);
    vp8x.writeUIntLE(16_383, 12, 3);
    vp8x.writeUIntLE(16_383, 15, 3);
    const body = Buffer.concat([Buffer.from("WEBP", "latin1"), vp8x, vp8]);
    const riff = Buffer.concat([Buffer.from("RIFF", "latin1"), Buffer.alloc(4), body]);
    riff.writeUInt32LE(body.length, 4);
    const r = await upload(riff, "bomb.webp");
    // Either the pixel limit (413) or the decoder's refusal of the mismatched canvas (400): never stored.
    expect([400, 413]).toContain(r.res.status);
    expectRefused(r, r.res.status);
  });
});

describe("declared types and names", () => {
  it("trusts the bytes, not the declaration: a PNG sent as image/jpeg named .jpg is stored as PNG", async () => {
    const r = await upload(await png(), "funnel.jpg", "image/jpeg");
    expect(r.res.status).toBe(201);
    expect(r.res.body.mimeType).toBe("image/png");
  });

  it.each([
    ["a shell script declared as a JPEG", Buffer.from("#!/bin/sh\nrm -rf /\n"), "image/jpeg"],
    ["an executable header declared as a PNG", Buffer.concat([Buffer.from("MZ"), Buffer.alloc(128)]), "image/png"],
    ["a PDF declared as a WebP", Buffer.from("%PDF-1.7\n1 0 obj\n<<>>\nendobj\n"), "image/webp"],
  ])("refuses %s with 415", async (_label, bytes, type) => {
    expectRefused(await upload(bytes, "photo.img", type), 415);
  });

  it.each(["../../../../tmp/phasewise-escape.jpg", "..\\..\\..\\phasewise-escape.jpg", "/etc/phasewise-escape.jpg", `${"a".repeat(600)}.jpg`])(
    "stores %j under a random key inside the photo folder, never by its name",
    async (name) => {
      const r = await upload(await jpeg(), name);
      expect(r.res.status).toBe(201);
      expect(r.filesAdded).toBe(2); // the image and its thumbnail
      expect(fs.existsSync("/tmp/phasewise-escape.jpg")).toBe(false);
      expect(fs.existsSync("/etc/phasewise-escape.jpg")).toBe(false);
      expect(fs.existsSync(path.resolve(t.deps.dataDir, "..", "phasewise-escape.jpg"))).toBe(false);
      for (const f of allFiles(photoDir())) {
        expect(path.resolve(f).startsWith(path.resolve(photoDir()) + path.sep)).toBe(true);
        expect(path.basename(f)).not.toMatch(/escape|aaaa|\.html/);
      }
      expect(JSON.stringify(r.res.body)).not.toMatch(/escape|\.html|aaaa/);
    },
  );

  it("refuses a NUL byte in the file name with 400, storing nothing", async () => {
    expectRefused(await upload(await jpeg(), "photo.jpg\u0000.html"), 400);
  });

  it("refuses a hostile name on a non-image without writing anywhere", async () => {
    const r = await upload(Buffer.from(SCRIPT), "../../../../tmp/phasewise-escape.html", "text/html");
    expectRefused(r, 415);
    expect(fs.existsSync("/tmp/phasewise-escape.html")).toBe(false);
  });
});
