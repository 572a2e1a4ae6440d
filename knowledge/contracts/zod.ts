import * as z from "zod/mini";

/*
 * The contracts validate with zod/mini, zod's functional build, which keeps the web bundle
 * small. zod/mini loads no locale: a check without a message of its own would say only
 * "Invalid input". English is loaded here, once, for every module that imports zod from here.
 */
z.config(z.locales.en());

export * from "zod/mini";
