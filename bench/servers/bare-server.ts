import express from "express";
import { listenForBench } from "./listen";

/** The baseline: a bare Express 5 JSON route, started the same way as the app. Prints "READY <port>". */
const app = express();
app.set("etag", false); // as in the app (server/app.ts)
app.use(express.json({ limit: "1mb" }));
app.post("/bare", (req, res) => {
  res.json({ ok: true, fields: Object.keys((req.body ?? {}) as object).length });
});
listenForBench(app);
