import { Router } from "express";
import type { AppDeps } from "../deps";
import { readEnv } from "../env";
import { HttpError } from "../middleware/errors";
import { outboxOf } from "../mail-outbox";

/**
 * The developer's outbox: every message the local SMTP stand-in caught, newest first, with its
 * links. Not mounted in production, where mail goes to a real service.
 */
export function devOutboxRouter(deps: AppDeps): Router {
  const router = Router();
  if (readEnv().NODE_ENV === "production") return router;

  router.get("/dev/outbox", (_req, res) => {
    const outbox = outboxOf(deps.mail);
    if (!outbox) throw new HttpError(404, "no_outbox", "Mail goes to a real service here (SMTP_URL is set); there is no local outbox.");
    res.json({ messages: outbox.messages().reverse() });
  });

  router.delete("/dev/outbox", (_req, res) => {
    const outbox = outboxOf(deps.mail);
    if (!outbox) throw new HttpError(404, "no_outbox", "There is no local outbox.");
    outbox.clear();
    res.json({ messages: [] });
  });

  return router;
}
