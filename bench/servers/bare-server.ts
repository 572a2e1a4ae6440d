import express from "express";
import type { AddressInfo } from "node:net";

/** The baseline: a bare Express 5 JSON route, started the same way as the app. Prints "READY <port>". */
const app = express();
app.use(express.json({ limit: "1mb" }));
app.post("/bare", (req, res) => {
  res.json({ ok: true, fields: Object.keys((req.body ?? {}) as object).length });
});
const server = app.listen(0, "127.0.0.1", () => {
  process.stdout.write(`READY ${(server.address() as AddressInfo).port}\n`);
});
process.on("SIGTERM", () => {
  server.close();
  server.closeAllConnections();
  process.exit(0);
});
