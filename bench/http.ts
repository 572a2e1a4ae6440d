import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { ROOT, startChild } from "./child";

/** What one route does under load. */
export interface LoadFigure {
  route: string;
  requestsPerSec: number;
  p50Ms: number;
  p99Ms: number;
  non2xx: number;
  errors: number;
}

export interface ComputeApiReport {
  connections: number;
  /** one connection: the time a request takes to serve, without queueing behind 49 others */
  serviceTime: LoadFigure[];
  durationS: number;
  /** mean of the bare route measured before and after the app's routes */
  bare: LoadFigure;
  bareRuns: LoadFigure[];
  /**
   * The same route handlers on a bare Express app (bench/servers/compute-server.ts): what the
   * validation, computation and JSON answer cost on their own, without the rest of the app.
   */
  handlersOnly: (LoadFigure & { throughputRatio: number })[];
  /**
   * The app's own answers to the sample bodies, sent by routes that do nothing else
   * (bench/servers/same-answer-server.ts): what the answer's size costs on its own.
   */
  sameAnswer: (LoadFigure & { throughputRatio: number; answerBytes: number })[];
  /** registered: the route answered the sample body with 200 (status says what it answered) */
  routes: (LoadFigure & { throughputRatio: number; registered: boolean; status: number })[];
}

/** A DCM / 10 % brine layer check (CRC values in tests/api/layers.test.ts). */
export const LAYER_BODY = {
  organic: [{ solvent: "dichloromethane", volumeMl: 40 }],
  aqueous: { solute: "NaCl", concentration: { value: 10, unit: "%w/w" }, volumeMl: 20 },
  temperatureC: 20,
};

/** A three-wash plan of a fictional work-up (the shape tests/api/plans.test.ts uses). */
export const PLAN_BODY = {
  organic: { solvent: "EtOAc", volumeMl: 60 },
  components: [
    { name: "tolyl amine", kind: "base", pKa: 9.3, partitionCoefficient: 30, amountMmol: 2.5 },
    { name: "heptanoic acid", kind: "acid", pKa: 4.9, partitionCoefficient: 200, amountMmol: 1.5 },
    { name: "ketone product", kind: "neutral", partitionCoefficient: 8, amountMmol: 6 },
  ],
  washes: [
    { aqueous: { solute: "HCl", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 25, repeats: 2 },
    { aqueous: { solute: "sodium bicarbonate", concentration: "saturated" }, volumeMl: 25 },
    { aqueous: { solute: "brine", concentration: "saturated" }, volumeMl: 25 },
  ],
  temperatureC: 20,
};

/** The routes measured, with the body each is sent. */
const COMPUTE_ROUTES = [
  ["/api/layers/predict", LAYER_BODY],
  ["/api/plans/compute", PLAN_BODY],
] as const;

async function load(url: string, body: unknown, connections: number, durationS: number): Promise<LoadFigure> {
  const r = await autocannon({
    url,
    connections,
    duration: durationS,
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  return {
    route: new URL(url).pathname,
    requestsPerSec: r.requests.average,
    p50Ms: r.latency.p50,
    p99Ms: r.latency.p99,
    non2xx: r.non2xx,
    errors: r.errors + r.timeouts,
  };
}

async function answerOf(url: string, body: unknown): Promise<{ status: number; text: string }> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  return { status: res.status, text: await res.text() };
}

/**
 * Throughput and latency of the compute routes at `connections` connections, each against a bare
 * Express JSON route served by a child started the same way (node --import tsx, one process).
 * The bare route runs before and after, and its mean is the baseline, because this machine is shared.
 */
export async function benchComputeApi(opts: { connections: number; durationS: number }): Promise<ComputeApiReport> {
  const { connections, durationS } = opts;
  const ready = /READY (\d+)/;
  const bareRuns: LoadFigure[] = [];
  const bareService: LoadFigure[] = [];
  const measureBare = async () => {
    const { child, match } = await startChild(path.join(ROOT, "bench/servers/bare-server.ts"), { ready });
    try {
      const url = `http://127.0.0.1:${match[1]}/bare`;
      await load(url, LAYER_BODY, connections, Math.min(2, durationS)); // warm-up
      bareRuns.push(await load(url, LAYER_BODY, connections, durationS));
      if (bareRuns.length === 1) bareService.push(await load(url, LAYER_BODY, 1, Math.min(3, durationS)));
    } finally {
      await child.stop();
    }
  };

  const serviceTime: LoadFigure[] = [];
  await measureBare();
  serviceTime.push(...bareService.splice(0));
  const { child, match } = await startChild(path.join(ROOT, "bench/servers/app-server.ts"), { ready });
  const measured: { figure: LoadFigure; registered: boolean; status: number }[] = [];
  /** route → the app's answer to its sample body, as sent */
  const appAnswers = new Map<string, string>();
  try {
    for (const [route, body] of COMPUTE_ROUTES) {
      const url = `http://127.0.0.1:${match[1]}${route}`;
      const { status, text } = await answerOf(url, body);
      if (status !== 200) {
        measured.push({ figure: { route, requestsPerSec: 0, p50Ms: 0, p99Ms: 0, non2xx: 0, errors: 0 }, registered: false, status });
        continue;
      }
      appAnswers.set(route, text);
      await load(url, body, connections, Math.min(2, durationS));
      serviceTime.push(await load(url, body, 1, Math.min(3, durationS)));
      measured.push({ figure: await load(url, body, connections, durationS), registered: true, status });
    }
  } finally {
    await child.stop();
  }
  const handlersOnly: LoadFigure[] = [];
  {
    const { child: c, match: m } = await startChild(path.join(ROOT, "bench/servers/compute-server.ts"), { ready });
    try {
      for (const [route, body] of COMPUTE_ROUTES) {
        const url = `http://127.0.0.1:${m[1]}${route}`;
        if ((await answerOf(url, body)).status !== 200) continue;
        await load(url, body, connections, Math.min(2, durationS));
        handlersOnly.push(await load(url, body, connections, durationS));
      }
    } finally {
      await c.stop();
    }
  }
  const sameAnswer: (LoadFigure & { answerBytes: number })[] = [];
  if (appAnswers.size > 0) {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "phasewise-answers-")), "answers.json");
    fs.writeFileSync(file, JSON.stringify(Object.fromEntries([...appAnswers].map(([route, text]) => [route, JSON.parse(text) as unknown]))));
    const { child: c, match: m } = await startChild(path.join(ROOT, "bench/servers/same-answer-server.ts"), { ready, env: { PHASEWISE_BENCH_ANSWERS: file } });
    try {
      for (const [route, body] of COMPUTE_ROUTES) {
        const text = appAnswers.get(route);
        if (text === undefined) continue;
        const url = `http://127.0.0.1:${m[1]}${route}`;
        await load(url, body, connections, Math.min(2, durationS));
        sameAnswer.push({ ...(await load(url, body, connections, durationS)), answerBytes: Buffer.byteLength(text) });
      }
    } finally {
      await c.stop();
      fs.rmSync(path.dirname(file), { recursive: true, force: true });
    }
  }
  await measureBare();

  const mean = (f: (x: LoadFigure) => number) => bareRuns.reduce((a, x) => a + f(x), 0) / bareRuns.length;
  const bare: LoadFigure = {
    route: "/bare",
    requestsPerSec: mean((x) => x.requestsPerSec),
    p50Ms: mean((x) => x.p50Ms),
    p99Ms: mean((x) => x.p99Ms),
    non2xx: bareRuns.reduce((a, x) => a + x.non2xx, 0),
    errors: bareRuns.reduce((a, x) => a + x.errors, 0),
  };
  return {
    connections,
    durationS,
    serviceTime,
    bare,
    bareRuns,
    handlersOnly: handlersOnly.map((f) => ({ ...f, throughputRatio: f.requestsPerSec / bare.requestsPerSec })),
    sameAnswer: sameAnswer.map((f) => ({ ...f, throughputRatio: f.requestsPerSec / bare.requestsPerSec })),
    routes: measured.map(({ figure, registered, status }) => ({
      ...figure,
      registered,
      status,
      throughputRatio: registered ? figure.requestsPerSec / bare.requestsPerSec : 0,
    })),
  };
}
