import type { z } from "zod";
import { badRequest, zodFields } from "./errors";

/** Parses input with a zod schema or throws a 400 naming each bad field. */
export function parse<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw badRequest("Some fields need attention.", zodFields(result.error));
  return result.data;
}
