import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createMailer } from "../../server/mail/mailer.js";
import { passwordResetMail } from "../../server/mail/templates/password-reset.js";
import { startTestApp, type TestApp } from "../support/app.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";

const base = () => testEnv.baseUrl;
let admin: string;
let analyst: string;

/** Sends through the app's own fake SMTP server (scripts/test.ts gives it SMTP_PORT). */
async function sendToFake(to: string, subject: string): Promise<void> {
  const port = Number(process.env.SMTP_PORT);
  expect(port, "SMTP_PORT of the app's fake SMTP server").toBeGreaterThan(0);
  const mailer = createMailer({ host: "127.0.0.1", port, from: "no-reply@stillspan.test", ignoreTLS: true });
  const mail = passwordResetMail({ link: `${base()}/reset-password/${randomUUID()}`, expiresAt: new Date() });
  try {
    await mailer.send({ to, ...mail, subject });
  } finally {
    mailer.close();
  }
}

beforeAll(async () => {
  admin = await signIn(base(), "admin@stillspan.test");
  analyst = await signIn(base(), "analyst@stillspan.test");
});

describe("GET /api/dev/mailbox", () => {
  it("shows an administrator each message the fake SMTP server received, newest first", async () => {
    const to = `mailbox-${randomUUID()}@stillspan.test`;
    await sendToFake(to, "First message");
    await sendToFake(to, "Second message");

    const res = await api(base(), `/api/dev/mailbox?to=${encodeURIComponent(to)}`, { cookie: admin });
    expect(res.status).toBe(200);
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).toEqual(["Second message", "First message"]);
    const [latest] = res.body.messages;
    expect(latest).toMatchObject({ from: "no-reply@stillspan.test", to: [to] });
    expect(latest.text).toContain("/reset-password/");
    expect(latest.html).toContain("/reset-password/");
    expect(latest.sizeBytes).toBeGreaterThan(latest.text.length);
    expect(Date.parse(latest.receivedAt)).toBeGreaterThan(Date.now() - 60_000);
  });

  it("keeps only the messages to the asked recipient", async () => {
    const to = `mailbox-${randomUUID()}@stillspan.test`;
    await sendToFake(`someone-else-${randomUUID()}@stillspan.test`, "Not for this recipient");
    const res = await api(base(), `/api/dev/mailbox?to=${encodeURIComponent(to)}`, { cookie: admin });
    expect(res.body.messages).toEqual([]);
  });

  it("is refused to anonymous callers (401) and to non-administrators (403)", async () => {
    expect((await api(base(), "/api/dev/mailbox")).status).toBe(401);
    expect((await api(base(), "/api/dev/mailbox", { cookie: analyst })).status).toBe(403);
  });

  it("rejects a bad query with 400", async () => {
    const res = await api(base(), "/api/dev/mailbox?limit=100000", { cookie: admin });
    expect(res.status).toBe(400);
  });
});

describe("GET /api/dev/mailbox with a real SMTP server configured", () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp({ env: { SMTP_HOST: "smtp.invalid", SMTP_PORT: "587" } });
  });
  afterAll(() => app.close());

  it("does not exist (404), even for an administrator", async () => {
    const cookie = await signIn(app.baseUrl, "admin@stillspan.test");
    const res = await api(app.baseUrl, "/api/dev/mailbox", { cookie });
    expect(res.status).toBe(404);
  });
});
