/**
 * A local fake SMTP server for development and tests: real SMTP on loopback (smtp-server), each message parsed
 * (mailparser) and handed to `store`. It delivers nothing anywhere. STARTTLS is disabled because smtp-server's
 * built-in certificate has expired; clients connect in plain text on 127.0.0.1 only.
 */
import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface ReceivedMail {
  /** Envelope sender (MAIL FROM). */
  from: string;
  /** Envelope recipients (RCPT TO), Bcc included. */
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  receivedAt: Date;
  /** Size of the raw message as received, bytes. */
  sizeBytes: number;
  messageId: string | null;
}

export interface FakeSmtpOptions {
  /** Port to listen on; 0 picks a free one. */
  port: number;
  host?: string;
  store: (mail: ReceivedMail) => void | Promise<void>;
  /** Largest accepted message, bytes (default 10 MB). */
  maxSizeBytes?: number;
  onError?: (err: Error) => void;
}

export interface FakeSmtp {
  host: string;
  port: number;
  close(): Promise<void>;
}

function headerAddresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return list.flatMap((a) => a.value.map((v) => v.address ?? "")).filter(Boolean);
}

export async function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const host = options.host ?? "127.0.0.1";
  const maxSizeBytes = options.maxSizeBytes ?? 10 * 1024 * 1024;
  const server = new SMTPServer({
    name: "stillspan-fake-smtp",
    banner: "Stillspan local fake SMTP server: messages are stored, never delivered",
    disabledCommands: ["STARTTLS"],
    authOptional: true,
    allowInsecureAuth: true, // loopback only, no TLS on the fake
    // Any user name and password is accepted, so a mailer configured with credentials works against the fake.
    onAuth: (auth, _session, callback) => callback(null, { user: auth.username ?? "fake" }),
    size: maxSizeBytes,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      stream.on("error", callback);
      stream.on("end", () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error(`Message exceeds ${maxSizeBytes} bytes`), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        void (async () => {
          const parsed = await simpleParser(raw);
          const mailFrom = session.envelope.mailFrom;
          await options.store({
            from: (mailFrom && mailFrom.address) || headerAddresses(parsed.from)[0] || "",
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            receivedAt: new Date(),
            sizeBytes: raw.length,
            messageId: parsed.messageId ?? null,
          });
        })().then(
          () => callback(),
          (err: Error) => {
            options.onError?.(err);
            callback(Object.assign(new Error("Could not store the message"), { responseCode: 451 }));
          },
        );
      });
    },
  });
  server.on("error", (err) => options.onError?.(err));

  await new Promise<void>((resolve, reject) => {
    server.server.once("error", reject);
    server.listen(options.port, host, () => {
      server.server.off("error", reject);
      resolve();
    });
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
