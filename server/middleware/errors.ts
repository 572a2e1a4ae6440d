import type { ErrorRequestHandler, RequestHandler } from "express";
import { z } from "zod";
import { KnowledgeInputError } from "../../knowledge/types";

/** A typed HTTP error; the one error handler turns it into `{ error: { code, message, fields? } }`. */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>, extra?: Record<string, unknown>) =>
  new HttpError(400, "bad_request", message, fields, extra);
export const unauthorised = () => new HttpError(401, "unauthorised", "Sign in first.");
export const forbidden = (message = "Your role in this group does not allow that.") =>
  new HttpError(403, "forbidden", message);
export const notFound = (what = "That record") => new HttpError(404, "not_found", `${what} was not found.`);

export function zodFields(error: z.core.$ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, "not_found", `No API route ${req.method} ${req.path}.`));
};

interface MaybeCoded {
  code?: string;
  type?: string;
  status?: number;
  statusCode?: number;
}

export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, fields: err.fields, ...err.extra } });
    return;
  }
  // $ZodError: errors of classic schemas and of the contracts' zod/mini schemas alike
  if (err instanceof z.core.$ZodError) {
    const fields = zodFields(err);
    res.status(400).json({ error: { code: "bad_request", message: "Some fields need attention.", fields } });
    return;
  }
  if (err instanceof KnowledgeInputError) {
    res.status(400).json({
      error: {
        code: "bad_request",
        message: err.message,
        fields: { [err.field]: err.message },
        suggestions: err.suggestions,
      },
    });
    return;
  }
  const coded = err as MaybeCoded;
  if (coded?.code === "LIMIT_FILE_SIZE") {
    res.status(413).json({ error: { code: "too_large", message: "That file is too large." } });
    return;
  }
  if (typeof coded?.code === "string" && coded.code.startsWith("LIMIT_")) {
    res.status(400).json({ error: { code: "bad_upload", message: (err as Error).message } });
    return;
  }
  if (coded?.type === "entity.parse.failed") {
    res.status(400).json({ error: { code: "bad_json", message: "The request body is not valid JSON." } });
    return;
  }
  if (coded?.type === "entity.too.large") {
    res.status(413).json({ error: { code: "too_large", message: "The request body is too large." } });
    return;
  }
  // PostgreSQL stores no NUL character (SQLSTATE 22021/22P05): such input is the sender's, a 400.
  const sqlState = (err as { cause?: MaybeCoded })?.cause?.code ?? coded?.code;
  if (sqlState === "22021" || sqlState === "22P05") {
    res.status(400).json({ error: { code: "bad_request", message: "The request contains a character that cannot be stored (a NUL byte)." } });
    return;
  }
  const status = coded?.status ?? coded?.statusCode;
  if (typeof status === "number" && status >= 400 && status < 500) {
    res.status(status).json({ error: { code: "bad_request", message: (err as Error).message } });
    return;
  }
  console.error(err);
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on the server." } });
};
