// npm start: build the web app, then serve it and the API from one process on PORT (default 3000).
import { spawnSync, spawn } from "node:child_process";

const build = spawnSync("npx", ["expo", "export", "-p", "web"], {
  stdio: "inherit",
  env: { ...process.env, CI: "1", EXPO_OFFLINE: "1" },
});
if (build.status !== 0) process.exit(build.status ?? 1);

const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], { stdio: "inherit" });
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => server.kill(signal));
server.on("exit", (code) => process.exit(code ?? 0));
