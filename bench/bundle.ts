import { execFile } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { promisify } from "node:util";
import zlib from "node:zlib";
import { launchChromium } from "../scripts/chromium-launch";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "..");

export interface BundleSize {
  /** the JS files the page downloaded, as paths on the server */
  files: string[];
  bytes: number;
  gzipBytes: number;
}

export interface PackageShare {
  name: string;
  bytes: number;
  share: number;
}

/** One way of opening "/": what the browser downloaded and what it showed. */
export interface FirstScreen extends BundleSize {
  scenario: string;
  /** the path the app ended on ("/" may redirect) */
  landedOn: string;
  /** the first line of text on screen, to tell a rendered screen from a blank one */
  shows: string;
}

const CONTENT_TYPES: Record<string, string> = {
  ".html": "text/html; charset=utf-8",
  ".js": "application/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json",
  ".map": "application/json",
  ".png": "image/png",
  ".ico": "image/x-icon",
  ".ttf": "font/ttf",
};

/**
 * Serves an exported web build as the app's server does: files as they are, index.html for
 * any other path (single-page app), and a JSON 404 under /api (no API here). Loopback only.
 */
export async function serveStatic(outDir: string): Promise<{ url: string; close: () => Promise<void> }> {
  const root = path.resolve(outDir);
  const server = http.createServer((req, res) => {
    const pathname = decodeURIComponent(new URL(req.url ?? "/", "http://localhost").pathname);
    if (pathname.startsWith("/api/")) {
      res.writeHead(404, { "content-type": "application/json" });
      res.end(JSON.stringify({ error: { code: "not_found", message: "no API in this build's server" } }));
      return;
    }
    const file = path.join(root, pathname);
    const isFile = file.startsWith(root + path.sep) && fs.existsSync(file) && fs.statSync(file).isFile();
    const target = isFile ? file : path.join(root, "index.html");
    res.writeHead(200, { "content-type": CONTENT_TYPES[path.extname(target)] ?? "application/octet-stream" });
    fs.createReadStream(target).pipe(res);
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Replies the browser gets for a signed-in chemist, so "/" shows the home screen instead of sign-in. */
const SIGNED_IN: Record<string, unknown> = {
  "/api/auth/get-session": {
    session: { id: "bench-session", userId: "bench-user", token: "bench", expiresAt: "2999-01-01T00:00:00.000Z", createdAt: "2024-01-01T00:00:00.000Z", updatedAt: "2024-01-01T00:00:00.000Z" },
    user: { id: "bench-user", email: "chemist@bench.example", name: "Bench Chemist", emailVerified: true, createdAt: "2024-01-01T00:00:00.000Z", updatedAt: "2024-01-01T00:00:00.000Z" },
  },
  "/api/me": {
    user: { id: "bench-user", email: "chemist@bench.example", name: "Bench Chemist" },
    groups: [{ id: "bench-group", name: "Bench Group", slug: "bench-group", role: "chemist" }],
    activeGroupId: "bench-group",
  },
};


/**
 * Opens "/" in headless Chromium with an empty cache and adds up every JS response the page
 * received until the network was quiet: the scripts index.html names and every chunk loaded
 * after them. Sizes are the bytes served; gzip is what the same bytes compress to.
 */
export async function firstScreenDownloads(
  baseUrl: string,
  opts: { scenario: string; signedIn?: boolean; landsOn: string; shows: RegExp },
): Promise<FirstScreen> {
  const { context, profile } = await launchChromium({ width: 390, height: 844 }, "phasewise-bench-chromium-");
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    if (opts.signedIn) {
      await page.route("**/api/**", (route) => {
        const body = SIGNED_IN[new URL(route.request().url()).pathname];
        return body ? route.fulfill({ status: 200, contentType: "application/json", body: JSON.stringify(body) }) : route.continue();
      });
    }
    const scripts: Promise<{ file: string; body: Buffer }>[] = [];
    page.on("response", (res) => {
      const type = res.headers()["content-type"] ?? "";
      if (res.request().resourceType() === "script" || type.includes("javascript")) {
        scripts.push(res.body().then((body) => ({ file: new URL(res.url()).pathname, body })));
      }
    });
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await page.goto(`${baseUrl}/`, { waitUntil: "networkidle" });
    // A redirect or a lazily loaded chunk can start after the first quiet spell: wait for text, then quiet again.
    await page
      .waitForFunction(() => (document.getElementById("root")?.innerText.trim() ?? "") !== "", undefined, { timeout: 30_000 })
      .catch((e: Error) => {
        throw new Error(`${opts.scenario}: "/" showed no text at ${page.url()} (${e.message}; page errors: ${errors.join(" | ") || "none"})`);
      });
    await page.waitForLoadState("networkidle");
    await page.waitForTimeout(500);
    await page.waitForLoadState("networkidle");
    const shows = (await page.evaluate(() => document.getElementById("root")?.innerText ?? "")).trim().split("\n")[0] ?? "";
    const landedOn = new URL(page.url()).pathname;
    // Measuring the wrong screen (a stale build, a session the app refused) must not pass for a result.
    if (landedOn !== opts.landsOn || !opts.shows.test(shows)) {
      throw new Error(`${opts.scenario}: "/" landed on ${landedOn} showing "${shows}", not ${opts.landsOn} matching ${opts.shows}`);
    }
    const loaded = await Promise.all(scripts);
    return {
      scenario: opts.scenario,
      landedOn,
      shows,
      files: loaded.map((s) => s.file),
      bytes: loaded.reduce((n, s) => n + s.body.length, 0),
      gzipBytes: loaded.reduce((n, s) => n + zlib.gzipSync(s.body).length, 0),
    };
  } finally {
    await context.close();
    fs.rmSync(profile, { recursive: true, force: true });
  }
}

/** `tmpDir` gives Metro a cache of its own (it keeps one under the system temp folder). */
async function expoExport(projectDir: string, outDir: string, opts: { sourceMaps: boolean; tmpDir?: string }) {
  const args = ["expo", "export", "-p", "web", "--output-dir", outDir, ...(opts.sourceMaps ? ["--source-maps"] : [])];
  if (opts.tmpDir) fs.mkdirSync(opts.tmpDir, { recursive: true });
  await run("npx", args, {
    cwd: projectDir,
    env: { ...process.env, CI: "1", EXPO_OFFLINE: "1", ...(opts.tmpDir ? { TMPDIR: opts.tmpDir } : {}) },
    maxBuffer: 64 * 1024 * 1024,
  });
}

/** A bare Expo Router app (one route, one text) beside the real one, on the same installed packages. */
function writeBareProject(dir: string) {
  fs.mkdirSync(path.join(dir, "app"), { recursive: true });
  fs.symlinkSync(path.join(ROOT, "node_modules"), path.join(dir, "node_modules"), "dir");
  fs.writeFileSync(path.join(dir, "package.json"), JSON.stringify({ name: "bare-router", private: true, main: "expo-router/entry" }));
  fs.writeFileSync(
    path.join(dir, "app.json"),
    JSON.stringify({ expo: { name: "bare", slug: "bare", scheme: "bare", web: { output: "single", bundler: "metro" }, plugins: ["expo-router"] } }),
  );
  fs.writeFileSync(
    path.join(dir, "app", "index.js"),
    'import { Text } from "react-native";\nexport default function Index() {\n  return <Text>One route, one text.</Text>;\n}\n',
  );
}

/** Decodes a source map's mappings and adds up generated bytes per npm package (or "app code"). */
export function bytesByPackage(mapFile: string, jsFile: string): PackageShare[] {
  const map = JSON.parse(fs.readFileSync(mapFile, "utf8")) as { sources: string[]; mappings: string };
  const lines = fs.readFileSync(jsFile, "utf8").split("\n");
  const owner = map.sources.map((s) => {
    const i = s.lastIndexOf("node_modules/");
    if (i < 0) return "(app code)";
    const rest = s.slice(i + "node_modules/".length).split("/");
    return rest[0]!.startsWith("@") ? `${rest[0]}/${rest[1]}` : rest[0]!;
  });
  const totals = new Map<string, number>();
  const add = (name: string, n: number) => totals.set(name, (totals.get(name) ?? 0) + n);
  let source = 0;
  const mappingLines = map.mappings.split(";");
  mappingLines.forEach((segs, lineNo) => {
    const lineLen = (lines[lineNo] ?? "").length;
    const points: { col: number; src: number }[] = [];
    let col = 0;
    for (const seg of segs.split(",")) {
      if (!seg) continue;
      const v = decodeVlq(seg);
      col += v[0]!;
      if (v.length >= 4) source += v[1]!;
      points.push({ col, src: v.length >= 4 ? source : -1 });
      // Fields 3–5 (source line/column, name) only move state we do not need.
    }
    points.forEach((p, k) => {
      const end = points[k + 1]?.col ?? lineLen;
      add(p.src >= 0 ? (owner[p.src] ?? "(unknown)") : "(unmapped)", Math.max(0, end - p.col));
    });
  });
  const all = [...totals.values()].reduce((a, b) => a + b, 0) || 1;
  return [...totals.entries()].map(([name, bytes]) => ({ name, bytes, share: bytes / all })).sort((a, b) => b.bytes - a.bytes);
}

const B64 = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";
function decodeVlq(seg: string): number[] {
  const out: number[] = [];
  let value = 0;
  let shift = 0;
  for (const ch of seg) {
    const digit = B64.indexOf(ch);
    value += (digit & 31) << shift;
    if (digit & 32) shift += 5;
    else {
      out.push(value & 1 ? -(value >>> 1) : value >>> 1);
      value = 0;
      shift = 0;
    }
  }
  return out;
}

export interface BundleReport {
  /** the heavier of the app's first screens (signed out or signed in), held against the target */
  app: FirstScreen;
  /** every way of opening the app's "/" that was measured */
  appScreens: FirstScreen[];
  bare: FirstScreen;
  ratioBytes: number;
  ratioGzip: number;
  /** the largest packages in what the heavier first screen downloaded (from the source maps) */
  topPackages: PackageShare[];
  /** packages in it and not in the bare app's first screen, largest first */
  extraPackages: PackageShare[];
}

/** Adds up bytesByPackage over the downloaded files that have a source map beside them. */
function sharesOf(outDir: string, files: string[]): PackageShare[] {
  const totals = new Map<string, number>();
  for (const f of new Set(files)) {
    const js = path.join(outDir, f);
    if (!fs.existsSync(`${js}.map`)) continue;
    for (const p of bytesByPackage(`${js}.map`, js)) totals.set(p.name, (totals.get(p.name) ?? 0) + p.bytes);
  }
  const all = [...totals.values()].reduce((a, b) => a + b, 0) || 1;
  return [...totals.entries()].map(([name, bytes]) => ({ name, bytes, share: bytes / all })).sort((a, b) => b.bytes - a.bytes);
}

async function measure<T>(outDir: string, fn: (url: string) => Promise<T>): Promise<T> {
  const server = await serveStatic(outDir);
  try {
    return await fn(server.url);
  } finally {
    await server.close();
  }
}

export async function benchBundle(tmp: string): Promise<BundleReport> {
  const appOut = path.join(tmp, "web-app");
  const bareDir = path.join(tmp, "bare-router");
  const bareOut = path.join(tmp, "web-bare");
  writeBareProject(bareDir);
  // One at a time: two Metro builds at once would fight over two cores.
  await expoExport(ROOT, appOut, { sourceMaps: true });
  // The bare app builds with a cold cache: Metro's shared cache can hand a project another
  // bare project's route table (seen with a copy of this one elsewhere on the machine).
  await expoExport(bareDir, bareOut, { sourceMaps: true, tmpDir: path.join(tmp, "bare-metro-tmp") });
  const appScreens = await measure(appOut, async (url) => [
    await firstScreenDownloads(url, { scenario: "signed out", landsOn: "/sign-in", shows: /^Phasewise$/ }),
    await firstScreenDownloads(url, { scenario: "signed in", signedIn: true, landsOn: "/", shows: /^Hello, Bench$/ }),
  ]);
  const bare = await measure(bareOut, (url) => firstScreenDownloads(url, { scenario: "bare", landsOn: "/", shows: /^One route, one text\.$/ }));
  for (const s of [...appScreens, bare]) {
    console.error(
      `[bench]   ${s.scenario}: "/" landed on ${s.landedOn} showing "${s.shows}"; ${s.files.length} JS files, ${(s.bytes / 1024).toFixed(0)} KiB, ${(s.gzipBytes / 1024).toFixed(0)} KiB gzip`,
    );
  }
  const app = appScreens.reduce((a, b) => (b.bytes > a.bytes ? b : a));
  const appShares = sharesOf(appOut, app.files);
  const bareNames = new Set(sharesOf(bareOut, bare.files).map((p) => p.name));
  return {
    app,
    appScreens,
    bare,
    ratioBytes: app.bytes / bare.bytes,
    ratioGzip: app.gzipBytes / bare.gzipBytes,
    topPackages: appShares.slice(0, 12),
    extraPackages: appShares.filter((p) => !bareNames.has(p.name)).slice(0, 12),
  };
}
