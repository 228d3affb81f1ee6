/**
 * Outgoing e-mail over SMTP (nodemailer). In production the SMTP settings come from the environment; in
 * development and tests the transport points at the local fake SMTP server on loopback (no TLS there: the fake
 * disables STARTTLS, so the transport must not try it).
 */
import nodemailer, { type Transporter } from "nodemailer";

export interface SmtpSettings {
  host: string;
  port: number;
  /** Implicit TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure?: boolean;
  user?: string;
  password?: string;
  /** Sender address of every message. */
  from: string;
  /** Never attempt STARTTLS (only for the loopback fake). */
  ignoreTLS?: boolean;
}

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<{ messageId: string; accepted: string[] }>;
  close(): void;
}

export const DEFAULT_FROM = "Stillspan <no-reply@stillspan.test>";

export function createMailer(settings: SmtpSettings): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure ?? settings.port === 465,
    ignoreTLS: settings.ignoreTLS ?? false,
    auth: settings.user ? { user: settings.user, pass: settings.password ?? "" } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    async send(mail) {
      const info = await transport.sendMail({ from: settings.from, ...mail });
      const accepted = (info.accepted ?? []).map((a: unknown) =>
        typeof a === "string" ? a : String((a as { address?: string }).address),
      );
      return { messageId: info.messageId, accepted };
    },
    close: () => transport.close(),
  };
}
