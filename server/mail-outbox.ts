import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import { createSmtpMailer, type Mailer } from "./mail";

/*
 * The local stand-in for a mail service in development and tests: a small SMTP server on
 * 127.0.0.1 that keeps every message it receives. The app sends to it through nodemailer exactly
 * as it would to a real service, so what lands here is what a real inbox would get.
 */

export interface CapturedMail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** every http(s) address in the message, in order, without duplicates */
  links: string[];
  receivedAt: string;
}

export interface MailOutbox {
  /** smtp://127.0.0.1:<port> */
  url: string;
  port: number;
  /** newest last */
  messages(): CapturedMail[];
  clear(): void;
  /** Resolves with the first message (already here or still to come) that matches. */
  waitFor(match: (m: CapturedMail) => boolean, timeoutMs?: number): Promise<CapturedMail>;
  close(): Promise<void>;
}

/** A Mailer that sends through SMTP to an outbox, and keeps the outbox for the developer page. */
export type OutboxMailer = Mailer & { outbox: MailOutbox };

const MAX_KEPT = 200;
const LINK = /https?:\/\/[^\s<>"')\]]+/g;

export function linksIn(text: string): string[] {
  return [...new Set(text.match(LINK) ?? [])];
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? "")).filter(Boolean);
}

/** Starts the outbox on a free loopback port (or `port`). */
export async function startMailOutbox(options: { port?: number } = {}): Promise<MailOutbox> {
  const kept: CapturedMail[] = [];
  const waiters: { match: (m: CapturedMail) => boolean; resolve: (m: CapturedMail) => void }[] = [];

  const server = new SMTPServer({
    // Loopback only, no accounts: the outbox is for one developer's machine or one test run.
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    banner: "Phasewise local outbox",
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, session, done) {
      simpleParser(stream)
        .then((parsed) => {
          const text = parsed.text ?? "";
          const html = typeof parsed.html === "string" ? parsed.html : null;
          const mail: CapturedMail = {
            id: crypto.randomUUID(),
            from: addresses(parsed.from)[0] ?? session.envelope.mailFrom?.toString() ?? "",
            to: addresses(parsed.to).length ? addresses(parsed.to) : session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text,
            html,
            links: linksIn(`${text}\n${html ?? ""}`),
            receivedAt: new Date().toISOString(),
          };
          kept.push(mail);
          if (kept.length > MAX_KEPT) kept.shift();
          for (const w of [...waiters]) {
            if (w.match(mail)) {
              waiters.splice(waiters.indexOf(w), 1);
              w.resolve(mail);
            }
          }
          done();
        })
        .catch((err: Error) => done(err));
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, "127.0.0.1", () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;

  return {
    url: `smtp://127.0.0.1:${port}`,
    port,
    messages: () => [...kept],
    clear: () => {
      kept.length = 0;
    },
    waitFor(match, timeoutMs = 5000) {
      const found = kept.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = {
          match,
          resolve: (m: CapturedMail) => {
            clearTimeout(timer);
            resolve(m);
          },
        };
        const timer = setTimeout(() => {
          waiters.splice(waiters.indexOf(waiter), 1);
          reject(new Error(`No matching message reached the outbox within ${timeoutMs} ms.`));
        }, timeoutMs);
        waiters.push(waiter);
      });
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Starts an outbox and a nodemailer SMTP mailer pointed at it. */
export async function createOutboxMailer(from: string, options: { port?: number } = {}): Promise<OutboxMailer> {
  const outbox = await startMailOutbox(options);
  const smtp = createSmtpMailer(outbox.url, from);
  return { outbox, send: (mail) => smtp.send(mail) };
}

/** The outbox behind a mailer, when it has one (the developer page lists it). */
export function outboxOf(mailer: Mailer): MailOutbox | undefined {
  return (mailer as Partial<OutboxMailer>).outbox;
}

/**
 * The mailer a server process uses: SMTP_URL when set (a real service); otherwise, outside
 * production, the local outbox on a loopback port; in production without SMTP_URL, the console.
 */
export async function mailerFromSettings(settings: {
  smtpUrl?: string;
  from: string;
  production: boolean;
  outboxPort?: number;
}): Promise<{ mail: Mailer; describe: string; close: () => Promise<void> }> {
  if (settings.smtpUrl) {
    return { mail: createSmtpMailer(settings.smtpUrl, settings.from), describe: "mail via SMTP_URL", close: async () => undefined };
  }
  if (settings.production) {
    console.warn("SMTP_URL is not set: mail is written to the log instead of being sent.");
    return {
      mail: { send: async (m) => console.log(`[mail] to ${m.to}: ${m.subject}\n${m.text}`) },
      describe: "mail to the log (set SMTP_URL)",
      close: async () => undefined,
    };
  }
  const mailer = await createOutboxMailer(settings.from, { port: settings.outboxPort });
  return { mail: mailer, describe: `mail caught by the local outbox on ${mailer.outbox.url} (/dev/outbox)`, close: () => mailer.outbox.close() };
}
