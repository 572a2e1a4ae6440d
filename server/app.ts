import fs from "node:fs";
import path from "node:path";
import express, { type RequestHandler, type Router } from "express";
import helmet from "helmet";
import { toNodeHandler } from "better-auth/node";
import type { Database } from "../db/client";
import { createAuth } from "./auth";
import type { AppDeps } from "./deps";
import type { Mailer } from "./mail";
import { apiNotFound, errorHandler } from "./middleware/errors";
import { loadSession } from "./middleware/session";
import { sameOriginWrites } from "./middleware/origin";
import { auditRouter } from "./routes/audit";
import { casesRouter } from "./routes/cases";
import { backupRouter } from "./routes/backup";
import { insightRouter } from "./routes/insight";
import { curationRouter } from "./routes/curation";
import { adviceRouter } from "./routes/advice";
import { referenceRouter } from "./routes/reference";
import { invitationsRouter } from "./routes/invitations";
import { digestRouter } from "./routes/digest";
import { devOutboxRouter } from "./routes/dev-outbox";
import { groupsRouter } from "./routes/groups";
import { emulsionRouter } from "./routes/emulsion";
import { healthRouter } from "./routes/health";
import { evaporationRouter } from "./routes/evaporation";
import { plansRouter } from "./routes/plans";
import { solventChoiceRouter } from "./routes/solvent-choice";
import { photosRouter } from "./routes/photos";
import { createLocalStorage, type Storage } from "./storage";
import { layersRouter } from "./routes/layers";
import { solventsRouter } from "./routes/solvents";

export interface CreateAppOptions {
  db: Database;
  dbKind: "pglite" | "postgres";
  mail: Mailer;
  baseURL?: string;
  secret?: string;
  trustedOrigins?: string[];
  dataDir?: string;
  /** Folder of the exported web app; served with a client-side fallback when present. */
  webDir?: string;
  rateLimit?: { enabled: boolean; window?: number; max?: number };
  quiet?: boolean;
  /** Defaults to a local folder <dataDir>/photos. */
  storage?: Storage;
}

/** Each area adds its router here (one line). Routers mount under /api. */
const AREA_ROUTERS: ((deps: AppDeps) => Router)[] = [healthRouter, groupsRouter, solventsRouter, layersRouter, emulsionRouter, auditRouter, casesRouter, photosRouter, referenceRouter, plansRouter, evaporationRouter, solventChoiceRouter, adviceRouter, curationRouter, insightRouter, invitationsRouter, digestRouter, devOutboxRouter, backupRouter];

interface RouteLayer {
  route?: { path: unknown };
}

/**
 * The area routers, dispatched by the first segment of the path: /api/layers/predict only walks
 * the routers that have a route under /layers, instead of every area's routes in turn (Express
 * tries each router's layers in order). A router with a path that starts with a parameter or a
 * pattern is tried for every segment. Order among the routers is kept. `stack` lists every
 * router's layers, so tools that read the app's routes from Express's stack still see them all.
 */
function areaDispatcher(routers: Router[]): RequestHandler & { stack: unknown[] } {
  const everywhere = new Set<Router>();
  const bySegment = new Map<string, Router[]>();
  for (const router of routers) {
    for (const layer of router.stack as RouteLayer[]) {
      const path = layer.route?.path;
      const segment = typeof path === "string" ? /^\/([A-Za-z0-9_.-]+)(?:\/|$)/.exec(path)?.[1] : undefined;
      if (segment === undefined) everywhere.add(router);
      else bySegment.set(segment.toLowerCase(), [...new Set([...(bySegment.get(segment.toLowerCase()) ?? []), router])]);
    }
  }
  const ordered = (list: Iterable<Router>) => routers.filter((r) => new Set(list).has(r));
  const fallback = ordered(everywhere);
  const table = new Map([...bySegment].map(([segment, list]) => [segment, ordered([...list, ...everywhere])]));
  const dispatch: RequestHandler = (req, res, next) => {
    // Express matches paths case-insensitively; so does the table.
    const segment = (/^\/([^/?#]*)/.exec(req.url)?.[1] ?? "").toLowerCase();
    const list = table.get(segment) ?? fallback;
    let i = 0;
    const step = (err?: unknown) => {
      if (err !== undefined && err !== null && err !== "router" && err !== "route") return next(err);
      const router = list[i++];
      if (!router) return next();
      router(req, res, step);
    };
    step();
  };
  return Object.assign(dispatch, { stack: routers.flatMap((r) => r.stack) });
}

export function createApp(options: CreateAppOptions) {
  const baseURL = options.baseURL ?? "http://localhost:3000";
  const auth = createAuth({
    db: options.db,
    mail: options.mail,
    baseURL,
    secret: options.secret ?? "phasewise-development-secret-change-me",
    trustedOrigins: [baseURL, ...(options.trustedOrigins ?? [])],
    rateLimit: options.rateLimit,
    quiet: options.quiet,
  });
  const dataDir = options.dataDir ?? "./data";
  const deps: AppDeps = {
    db: options.db,
    dbKind: options.dbKind,
    auth,
    mail: options.mail,
    baseURL,
    dataDir,
    storage: options.storage ?? createLocalStorage(path.join(dataDir, "photos")),
  };

  const app = express();
  app.disable("x-powered-by");
  // API answers are computed per request and nothing revalidates them: hashing every body for
  // an ETag is wasted work. Static files and photos set their own validators.
  app.set("etag", false);
  app.set("trust proxy", "loopback");
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          "default-src": ["'self'"],
          "script-src": ["'self'", "'unsafe-inline'"],
          "style-src": ["'self'", "'unsafe-inline'"],
          "img-src": ["'self'", "data:", "blob:"],
          "font-src": ["'self'", "data:"],
          "connect-src": ["'self'", "ws:", "wss:"],
        },
      },
    }),
  );
  // The sign-in rate limit keys on the client address; pass the socket's, never a client-sent header.
  app.use((req, _res, next) => {
    req.headers["x-phasewise-client-ip"] = req.socket.remoteAddress ?? "unknown";
    next();
  });
  // better-auth reads its own body: mount it before express.json().
  app.all("/api/auth/*splat", toNodeHandler(auth));
  // Our own writes refuse other sites too (better-auth checks its routes itself).
  app.use("/api", sameOriginWrites([baseURL, ...(options.trustedOrigins ?? [])]));
  app.use(express.json({ limit: "1mb" }));
  app.use("/api", loadSession(auth));
  app.use("/api", areaDispatcher(AREA_ROUTERS.map((make) => make(deps))));
  app.use("/api", apiNotFound);

  if (options.webDir && fs.existsSync(path.join(options.webDir, "index.html"))) {
    const webDir = path.resolve(options.webDir);
    app.use(express.static(webDir, { index: false, maxAge: "1h" }));
    app.get("/{*splat}", (_req, res) => res.sendFile(path.join(webDir, "index.html")));
  }
  app.use(errorHandler);
  return { app, auth, deps };
}
