import fs from "node:fs";
import express from "express";
import { listenForBench } from "./listen";

/*
 * The cost of the answer's size alone: each compute route answers with the app's own answer to
 * the sample body (read once from the JSON file named in PHASEWISE_BENCH_ANSWERS, route → body),
 * serialised and sent as a real route would, with no validation, look-up or computation.
 * The gap between the bare route and this is the bytes (serialising, writing, and the load
 * generator reading them on the same machine); the gap between this and the handlers is the work.
 * Prints "READY <port>".
 */
const answers = JSON.parse(fs.readFileSync(process.env.PHASEWISE_BENCH_ANSWERS ?? "", "utf8")) as Record<string, unknown>;
const app = express();
app.set("etag", false);
app.use(express.json({ limit: "1mb" }));
for (const [route, answer] of Object.entries(answers)) {
  app.post(route, (_req, res) => {
    res.json(answer);
  });
}
listenForBench(app);
