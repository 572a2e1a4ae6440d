import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { benchBundle, type BundleReport } from "./bundle";
import { ROOT } from "./child";
import { benchClientCompute, type ClientComputeReport } from "./client";
import { benchComputeApi, type ComputeApiReport } from "./http";
import { benchSearch, type SearchReport } from "./search";
import { benchStartup, type StartupReport } from "./startup";

/*
 * npm run bench [-- --only=bundle,api,search,startup,client] [-- --quick]
 * Every figure comes with a baseline measured in the same run (this machine is shared and
 * noisy), prints as a table and lands in build/bench/report.json (and a dated copy).
 */

const TARGETS = {
  bundleRatio: 1.25,
  throughputRatio: 0.8,
  layerP99Ms: 10,
  searchP95MsAt20k: 30,
};

const args = process.argv.slice(2);
const quick = args.includes("--quick");
const only = args.find((a) => a.startsWith("--only="))?.slice("--only=".length).split(",");
const wants = (part: string) => !only || only.includes(part);

interface Report {
  startedAt: string;
  machine: { cpus: number; loadAverageAtStart: number[]; loadAverageAtEnd?: number[]; node: string };
  quick: boolean;
  bundle?: BundleReport;
  computeApi?: ComputeApiReport;
  search?: SearchReport;
  startup?: StartupReport;
  client?: ClientComputeReport;
  rows: Row[];
}

interface Row {
  area: string;
  figure: string;
  value: string;
  baseline: string;
  ratio: string;
  target: string;
  met: "yes" | "no" | "—";
}

const kb = (n: number) => `${(n / 1024).toFixed(0)} KiB`;
const ms = (n: number) => `${n.toFixed(n < 10 ? 2 : 1)} ms`;
const x = (n: number) => `${n.toFixed(2)}×`;
const met = (ok: boolean): Row["met"] => (ok ? "yes" : "no");

function printTable(rows: Row[]) {
  const head: Row = { area: "area", figure: "figure", value: "value", baseline: "baseline", ratio: "ratio", target: "target", met: "—" };
  const cols = Object.keys(head) as (keyof Row)[];
  const width = (c: keyof Row) => Math.max(...[head, ...rows].map((r) => String(r[c]).length));
  const line = (r: Row) => cols.map((c) => String(c === "met" && r === head ? "met" : r[c]).padEnd(width(c))).join("  ");
  console.log(line(head));
  console.log(cols.map((c) => "-".repeat(width(c))).join("  "));
  for (const r of rows) console.log(line(r));
}

async function main() {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "phasewise-bench-"));
  const report: Report = {
    startedAt: new Date().toISOString(),
    machine: { cpus: os.cpus().length, loadAverageAtStart: os.loadavg(), node: process.version },
    quick,
    rows: [],
  };
  const rows = report.rows;
  const step = (name: string) => console.error(`[bench] ${name}… (load average ${os.loadavg()[0]!.toFixed(1)})`);
  try {
    if (wants("bundle")) {
      step("web bundle: exporting the app and a bare Expo Router app");
      const b = (report.bundle = await benchBundle(tmp));
      rows.push(
        { area: "web bundle", figure: "first-screen JS", value: kb(b.app.bytes), baseline: kb(b.bare.bytes), ratio: x(b.ratioBytes), target: `≤ ${TARGETS.bundleRatio}×`, met: met(b.ratioBytes <= TARGETS.bundleRatio) },
        { area: "web bundle", figure: "first-screen JS, gzip", value: kb(b.app.gzipBytes), baseline: kb(b.bare.gzipBytes), ratio: x(b.ratioGzip), target: `≤ ${TARGETS.bundleRatio}×`, met: met(b.ratioGzip <= TARGETS.bundleRatio) },
      );
    }
    if (wants("api")) {
      step("compute API under load");
      const a = (report.computeApi = await benchComputeApi({ connections: 50, durationS: quick ? 3 : 10 }));
      const bareRow = `${a.bare.requestsPerSec.toFixed(0)} req/s`;
      for (const r of a.routes) {
        if (!r.registered) {
          rows.push({ area: "compute API", figure: `${r.route}`, value: r.status === 404 ? "not registered" : `sample body answered ${r.status}`, baseline: bareRow, ratio: "—", target: "—", met: "—" });
          continue;
        }
        rows.push({ area: "compute API", figure: `${r.route} throughput`, value: `${r.requestsPerSec.toFixed(0)} req/s`, baseline: bareRow, ratio: x(r.throughputRatio), target: `≥ ${TARGETS.throughputRatio}×`, met: met(r.throughputRatio >= TARGETS.throughputRatio) });
        const isLayer = r.route === "/api/layers/predict";
        rows.push({ area: "compute API", figure: `${r.route} p50 / p99`, value: `${ms(r.p50Ms)} / ${ms(r.p99Ms)}`, baseline: `${ms(a.bare.p50Ms)} / ${ms(a.bare.p99Ms)}`, ratio: x(r.p99Ms / Math.max(a.bare.p99Ms, 0.01)), target: isLayer ? `p99 ≤ ${TARGETS.layerP99Ms} ms` : "—", met: isLayer ? met(r.p99Ms <= TARGETS.layerP99Ms) : "—" });
      }
      for (const s of a.sameAnswer) {
        rows.push({ area: "compute API", figure: `${s.route}: its answer (${(s.answerBytes / 1024).toFixed(1)} KiB) sent with no work`, value: `${s.requestsPerSec.toFixed(0)} req/s`, baseline: bareRow, ratio: x(s.throughputRatio), target: "—", met: "—" });
      }
      for (const h of a.handlersOnly) {
        const inApp = a.routes.find((r) => r.route === h.route);
        rows.push({ area: "compute API", figure: `${h.route} handlers alone on bare Express`, value: `${h.requestsPerSec.toFixed(0)} req/s`, baseline: bareRow, ratio: x(h.throughputRatio), target: "—", met: "—" });
        if (inApp?.registered) rows.push({ area: "compute API", figure: `${h.route} in the app vs handlers alone`, value: `${inApp.requestsPerSec.toFixed(0)} req/s`, baseline: `${h.requestsPerSec.toFixed(0)} req/s`, ratio: x(inApp.requestsPerSec / h.requestsPerSec), target: "—", met: "—" });
      }
      const bareSvc = a.serviceTime.find((s) => s.route === "/bare");
      for (const s of a.serviceTime.filter((x) => x.route !== "/bare")) {
        rows.push({ area: "compute API", figure: `${s.route} p50 / p99, 1 connection`, value: `${ms(s.p50Ms)} / ${ms(s.p99Ms)}`, baseline: bareSvc ? `${ms(bareSvc.p50Ms)} / ${ms(bareSvc.p99Ms)}` : "—", ratio: bareSvc ? x(s.p99Ms / Math.max(bareSvc.p99Ms, 1)) : "—", target: s.route === "/api/layers/predict" ? `p99 ≤ ${TARGETS.layerP99Ms} ms` : "—", met: s.route === "/api/layers/predict" ? met(s.p99Ms <= TARGETS.layerP99Ms) : "—" });
      }
    }
    if (wants("client")) {
      step("client compute");
      const c = (report.client = benchClientCompute(quick ? 5_000 : 50_000));
      rows.push({ area: "client compute", figure: "layer check (schema + predictLayers)", value: `${c.predictUs.toFixed(1)} µs`, baseline: `${c.jsonRoundTripUs.toFixed(1)} µs JSON round trip`, ratio: x(c.ratio), target: "negligible (< 1 ms)", met: met(c.predictUs < 1000) });
    }
    if (wants("startup")) {
      step("start-up");
      const s = (report.startup = await benchStartup(tmp, { cases: quick ? 2_000 : 20_000 }));
      for (const r of s.runs) {
        rows.push({ area: "start-up", figure: r.label, value: `${ms(r.readyMs)} (server ${r.serverMs} ms), ${r.maxRssMb?.toFixed(0) ?? "?"} MiB peak`, baseline: `${ms(s.bare.readyMs)}, ${s.bare.maxRssMb?.toFixed(0) ?? "?"} MiB (bare Express)`, ratio: x(r.ratio), target: "—", met: "—" });
      }
    }
    if (wants("search")) {
      step("case search at growing sizes");
      const sizes = quick ? [1_000, 5_000] : [1_000, 20_000, 100_000];
      const s = (report.search = await benchSearch(tmp, { sizes, rounds: quick ? 2 : 5 }));
      const first = s.sizes[0]!;
      for (const z of s.sizes) {
        const at20k = z.cases === 20_000;
        const b = z.breakdown;
        rows.push({ area: "case search", figure: `${z.cases.toLocaleString("en")} cases, "brine" in SQL: version check / count / rank top 20`, value: `${ms(b.versionCheckMs)} / ${ms(b.countMatchesMs)} / ${ms(b.rankTop20Ms)}`, baseline: `${b.matches.toLocaleString("en")} matches`, ratio: "—", target: "—", met: "—" });
        rows.push({ area: "case search", figure: `${z.cases.toLocaleString("en")} cases p50 / p95 (first after change ${ms(z.coldMs)})`, value: `${ms(z.p50Ms)} / ${ms(z.p95Ms)}`, baseline: `${ms(first.p95Ms)} p95 at ${first.cases.toLocaleString("en")}`, ratio: x(z.growth), target: at20k ? `p95 ≤ ${TARGETS.searchP95MsAt20k} ms` : "—", met: at20k ? met(z.p95Ms <= TARGETS.searchP95MsAt20k) : "—" });
      }
    }
  } finally {
    fs.rmSync(tmp, { recursive: true, force: true });
  }
  report.machine.loadAverageAtEnd = os.loadavg();
  console.log("");
  printTable(rows);
  console.log(`\nload average at start ${report.machine.loadAverageAtStart.map((l) => l.toFixed(1)).join(" ")}, at end ${report.machine.loadAverageAtEnd.map((l) => l.toFixed(1)).join(" ")} (${report.machine.cpus} cores)`);
  const outDir = path.join(ROOT, "build", "bench");
  fs.mkdirSync(outDir, { recursive: true });
  const json = JSON.stringify(report, null, 2);
  fs.writeFileSync(path.join(outDir, "report.json"), json);
  fs.writeFileSync(path.join(outDir, `report-${report.startedAt.replace(/[:.]/g, "-")}.json`), json);
  console.log(`report: ${path.relative(process.cwd(), path.join(outDir, "report.json"))}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
