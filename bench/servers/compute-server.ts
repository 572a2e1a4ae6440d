import express from "express";
import { listenForBench } from "./listen";
import type { AppDeps } from "../../server/deps";
import { errorHandler } from "../../server/middleware/errors";
import { layersRouter } from "../../server/routes/layers";
import { plansRouter } from "../../server/routes/plans";

/*
 * The compute routes' own handlers (validation, the computation, the JSON answer) on a bare
 * Express app: no security headers, session, origin check or other areas. The gap between this
 * and the bare route is the work itself; the gap between this and the app is what the rest of
 * the app adds. Anonymous calls never touch the database, so none is opened. Prints "READY <port>".
 */
const app = express();
app.set("etag", false); // as in the app (server/app.ts)
app.use(express.json({ limit: "1mb" }));
const deps = {} as AppDeps;
app.use("/api", layersRouter(deps), plansRouter(deps));
app.use(errorHandler);
listenForBench(app);
