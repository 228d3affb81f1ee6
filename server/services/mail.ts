/**
 * Outgoing e-mail for the whole server. With SMTP_HOST set, messages go to that server (production). Without it,
 * the server runs the local fake SMTP server on 127.0.0.1:SMTP_PORT (default 2525), which stores every message in
 * dev_mail_messages for admins to read at /api/dev/mailbox; nothing leaves the machine.
 */
import type { Config } from "../config.js";
import type { Db } from "../db/client.js";
import { insertDevMail, listDevMail } from "../db/queries/dev-mail.js";
import { StartupError } from "../errors.js";
import type { Logger } from "../logger.js";
import { startFakeSmtp, type FakeSmtp } from "../mail/fake-smtp.js";
import { createMailer, DEFAULT_FROM, type Mailer, type OutgoingMail, type SmtpSettings } from "../mail/mailer.js";

export const FAKE_SMTP_DEFAULT_PORT = 2525;

type MailConfig = Pick<Config, "smtp">;

export function usesFakeSmtp(config: MailConfig): boolean {
  return !config.smtp.host;
}

export function smtpSettings(config: MailConfig): SmtpSettings {
  const { host, port, secure, user, password, from } = config.smtp;
  if (host) {
    return { host, port: port ?? (secure ? 465 : 587), secure, user, password, from: from ?? DEFAULT_FROM };
  }
  // The fake listens on loopback without TLS (its built-in certificate has expired): never try STARTTLS there.
  return { host: "127.0.0.1", port: port ?? FAKE_SMTP_DEFAULT_PORT, from: from ?? DEFAULT_FROM, ignoreTLS: true };
}

const mailers = new WeakMap<object, Mailer>();

/** The mailer of this configuration (one pooled transport per process). */
export function mailerFor(config: MailConfig): Mailer {
  let mailer = mailers.get(config.smtp);
  if (!mailer) {
    mailer = createMailer(smtpSettings(config));
    mailers.set(config.smtp, mailer);
  }
  return mailer;
}

/**
 * Starts the local fake SMTP server when no SMTP_HOST is configured; null otherwise. Each received message is
 * stored in dev_mail_messages. When SMTP_PORT is not set and the default port is taken (another checkout's
 * server, say), the fake takes a free port instead and the mailer follows it; a set SMTP_PORT that is taken stops
 * the start with one sentence saying what to do.
 */
export async function startFakeSmtpIfNeeded(config: MailConfig, db: Db, log: Logger): Promise<FakeSmtp | null> {
  if (!usesFakeSmtp(config)) return null;
  const explicit = config.smtp.port !== undefined;
  const start = (port: number) =>
    startFakeSmtp({
      port,
      store: (mail) => insertDevMail(db, mail),
      onError: (err) => log.error({ err }, "fake SMTP server error"),
    });
  const port = config.smtp.port ?? FAKE_SMTP_DEFAULT_PORT;
  try {
    return await start(port);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "EADDRINUSE") throw err;
    if (explicit) {
      throw new StartupError(
        `SMTP_PORT ${port} is in use, so the local fake SMTP server cannot start: set SMTP_PORT to a free port, ` +
          "or SMTP_HOST (and SMTP_PORT, SMTP_USER, SMTP_PASSWORD, SMTP_FROM) for a real server.",
      );
    }
    const fake = await start(0);
    config.smtp.port = fake.port; // before the first message: the mailer is created on first use
    log.warn({ busy: port, port: fake.port }, "the default fake SMTP port is in use: the local fake SMTP server took a free port");
    return fake;
  }
}

/**
 * Sends one message. A failure is logged and reported as `false`, never thrown: a notification that could not be
 * sent must not undo the action it reports (the action is already committed and audited).
 */
export async function deliverMail(
  ctx: { config: MailConfig; logger: Logger },
  mail: OutgoingMail,
): Promise<boolean> {
  try {
    const { messageId } = await mailerFor(ctx.config).send(mail);
    ctx.logger.info({ to: mail.to, subject: mail.subject, messageId }, "mail sent");
    return true;
  } catch (err) {
    ctx.logger.error({ err, to: mail.to, subject: mail.subject }, "mail could not be sent");
    return false;
  }
}

/** What the local fake SMTP server received, newest first, as the mailbox API shows it; `to` keeps one recipient's. */
export async function listDevMailbox(db: Db, filter: { to?: string; limit: number }) {
  const messages = await listDevMail(db, { to: filter.to?.toLowerCase(), limit: filter.limit });
  return messages.map((m) => ({
    id: m.id,
    from: m.fromAddress,
    to: m.toAddresses,
    subject: m.subject,
    text: m.text,
    html: m.html,
    sizeBytes: m.sizeBytes,
    receivedAt: m.receivedAt.toISOString(),
  }));
}
