import { create, unitDependencies } from "mathjs";

export type { Unit } from "mathjs";

/*
 * The unit engine: a mathjs instance built from `unit` and what it depends on, nothing else.
 * Node and jest take the factories from the package root; the web build takes the same
 * factories file by file (units.web.ts), so a typed quantity parses alike on both sides.
 * (mathjs types its dependency maps as a lookup by name, hence the `!`.)
 */
export const { unit } = create(unitDependencies!);
