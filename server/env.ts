import { z } from "zod";

/** The environment, parsed once. Nothing else reads process.env. */
const schema = z.object({
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  DATABASE_URL: z.string().url().optional(),
  PHASEWISE_DATA_DIR: z.string().default("./data"),
  PHASEWISE_DEMO: z.string().default("1"),
  /** "0" turns the sign-in rate limit off (the browser suites sign in many times a minute). */
  PHASEWISE_RATE_LIMIT: z.string().default("1"),
  /** Folder of the exported web app (default: dist/ beside the server). */
  PHASEWISE_WEB_DIR: z.string().optional(),
  BETTER_AUTH_SECRET: z.string().min(16).optional(),
  PUBLIC_URL: z.string().url().optional(),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default("Phasewise <no-reply@phasewise.invalid>"),
  /** Without SMTP_URL, the local outbox listens on this loopback port (0: any free port). */
  PHASEWISE_OUTBOX_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  /** Send the digest of stubborn cases and new verified fixes to leads every N hours; unset: off. */
  PHASEWISE_DIGEST_HOURS: z.coerce.number().positive().max(24 * 366).optional(),
  PHASEWISE_S3_BUCKET: z.string().optional(),
  PHASEWISE_S3_ENDPOINT: z.string().optional(),
  PHASEWISE_S3_REGION: z.string().default("us-east-1"),
  PHASEWISE_S3_ACCESS_KEY: z.string().optional(),
  PHASEWISE_S3_SECRET_KEY: z.string().optional(),
  NODE_ENV: z.string().default("development"),
});

export type Env = z.infer<typeof schema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  // An empty variable means "not set".
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ""));
  const parsed = schema.safeParse(cleaned);
  if (!parsed.success) {
    throw new Error(`Bad environment: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  }
  return parsed.data;
}
