// Browser tests: build the exported app, start the real server on a fresh demo database, run the e2e suites.
import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { ensureChromium } from "./chromium.mjs";

const chromium = ensureChromium();

// Each run exports into its own folder, so parallel runs never read a half-written bundle.
const webDir = mkdtempSync(path.join(os.tmpdir(), "phasewise-web-"));
const build = spawnSync("npx", ["expo", "export", "-p", "web", "--output-dir", webDir], {
  stdio: ["ignore", "ignore", "inherit"],
  env: { ...process.env, CI: "1", EXPO_OFFLINE: "1" },
});
if (build.status !== 0) {
  console.error("The web export failed.");
  process.exit(1);
}

const port = await new Promise((resolve) => {
  const s = net.createServer();
  s.listen(0, "127.0.0.1", () => {
    const p = s.address().port;
    s.close(() => resolve(p));
  });
});
const dataDir = mkdtempSync(path.join(os.tmpdir(), "phasewise-e2e-"));
const baseURL = `http://localhost:${port}`;
const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
  env: { ...process.env, PORT: String(port), PHASEWISE_DATA_DIR: dataDir, PUBLIC_URL: baseURL, DATABASE_URL: "", PHASEWISE_WEB_DIR: webDir, PHASEWISE_RATE_LIMIT: "0" },
  stdio: ["ignore", "pipe", "inherit"],
});
let log = "";
server.stdout.on("data", (d) => (log += d));

const deadline = Date.now() + 60_000;
let ready = false;
while (Date.now() < deadline) {
  try {
    const res = await fetch(`${baseURL}/api/health`);
    if (res.ok) {
      ready = true;
      break;
    }
  } catch {
    /* not yet */
  }
  await new Promise((r) => setTimeout(r, 250));
}
if (!ready) {
  console.error("The server did not start:\n" + log);
  server.kill("SIGKILL");
  process.exit(1);
}

const jest = spawnSync("npx", ["jest", "--selectProjects", "e2e", "--runInBand", ...process.argv.slice(2)], {
  stdio: "inherit",
  env: { ...process.env, PHASEWISE_E2E_URL: baseURL, PHASEWISE_CHROMIUM: chromium },
});
server.kill("SIGTERM");
await new Promise((r) => server.on("exit", r));
rmSync(dataDir, { recursive: true, force: true });
rmSync(webDir, { recursive: true, force: true });
process.exit(jest.status ?? 1);
