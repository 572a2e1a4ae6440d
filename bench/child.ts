import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

export const ROOT = path.resolve(__dirname, "..");

export interface Child {
  proc: ChildProcess;
  /** everything the child printed on stderr */
  stderr: () => string;
  /** SIGTERM, then resolves once it exited; the peak RSS it reported (KiB), when preloaded */
  stop: () => Promise<{ code: number | null; maxRssKb: number | null }>;
}

/**
 * Starts `node --import tsx <script>` and waits until a stdout line matches `ready`.
 * Loopback only: every server here listens on 127.0.0.1.
 */
export function startChild(
  script: string,
  opts: { env?: Record<string, string>; ready: RegExp; timeoutMs?: number; reportRss?: boolean },
): Promise<{ child: Child; match: RegExpMatchArray; readyMs: number }> {
  const started = performance.now();
  const args = ["--import", "tsx", ...(opts.reportRss ? ["--import", path.join(ROOT, "bench/servers/report-rss.ts")] : []), script];
  const proc = spawn(process.execPath, args, { cwd: ROOT, env: { ...process.env, ...opts.env }, stdio: ["ignore", "pipe", "pipe"] });
  let err = "";
  let out = "";
  proc.stderr!.on("data", (d: Buffer) => (err += d.toString()));
  const exited = new Promise<number | null>((resolve) => proc.once("exit", (code) => resolve(code)));
  const child: Child = {
    proc,
    stderr: () => err,
    stop: async () => {
      if (proc.exitCode === null && proc.signalCode === null) proc.kill("SIGTERM");
      const code = await exited;
      const m = /PHASEWISE_MAXRSS_KB (\d+)/.exec(err);
      return { code, maxRssKb: m ? Number(m[1]) : null };
    },
  };
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      proc.kill("SIGKILL");
      reject(new Error(`${script} did not start in time:\n${out}\n${err}`));
    }, opts.timeoutMs ?? 60_000);
    proc.stdout!.on("data", (d: Buffer) => {
      out += d.toString();
      const m = opts.ready.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve({ child, match: m, readyMs: performance.now() - started });
      }
    });
    void exited.then((code) => {
      clearTimeout(timer);
      reject(new Error(`${script} exited (${code}) before it was ready:\n${out}\n${err}`));
    });
  });
}
