import type { Database } from "../db/client";
import type { Auth } from "./auth";
import type { Mailer } from "./mail";
import type { Storage } from "./storage";

/** Everything a router may need; createApp builds it once. */
export interface AppDeps {
  db: Database;
  dbKind: "pglite" | "postgres";
  auth: Auth;
  mail: Mailer;
  /** Public origin used in links sent by mail. */
  baseURL: string;
  /** Folder for local files (photos, backups). */
  dataDir: string;
  /** Uploaded files (photos): a local folder by default, or an S3-compatible bucket. */
  storage: Storage;
}
