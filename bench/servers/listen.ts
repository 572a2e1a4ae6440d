import type { Express } from "express";
import type { AddressInfo } from "node:net";

/**
 * Serves `app` on a free loopback port and prints "READY <port>" (what bench/child.ts waits for);
 * on SIGTERM stops listening, drops open connections, runs `cleanup` and exits.
 */
export function listenForBench(app: Express, cleanup: () => Promise<void> = async () => {}): void {
  const server = app.listen(0, "127.0.0.1", () => {
    process.stdout.write(`READY ${(server.address() as AddressInfo).port}\n`);
  });
  process.on("SIGTERM", () => {
    server.close();
    server.closeAllConnections();
    void cleanup().finally(() => process.exit(0));
  });
}
