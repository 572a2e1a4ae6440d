import { z } from "zod";
import { badRequest, zodFields } from "./errors";

/** Parses input with a zod schema (classic or zod/mini, as the shared contracts are) or throws a 400 naming each bad field. */
export function parse<S extends z.core.$ZodType>(schema: S, value: unknown): z.output<S> {
  const result = z.safeParse(schema, value);
  if (!result.success) throw badRequest("Some fields need attention.", zodFields(result.error));
  return result.data;
}
