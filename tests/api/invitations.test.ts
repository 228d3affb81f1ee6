import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { invitations, passwordResets } from "../../server/db/schema/index.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, sessionCookieFrom, signIn } from "../support/http.js";
import { tokenFrom, waitForMail } from "../support/review.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
let projectId: number;
let admin: string;
let analyst: string;

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Invitation test crossing ${suffix}`, { "analyst@stillspan.test": "analyst" });
  admin = await signIn(base(), "admin@stillspan.test");
  analyst = await signIn(base(), "analyst@stillspan.test");
});
afterAll(() => db.$client.end());

async function invite(email: string, role = "viewer", name?: string) {
  const res = await api(base(), `/api/projects/${projectId}/invitations`, { cookie: admin, body: { email, role, name } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const [mail] = await waitForMail(base(), admin, email, "You are invited to");
  expect(mail, `invitation message to ${email}`).toBeDefined();
  return { invitation: res.body, mail, token: tokenFrom(mail, "/accept-invite") };
}

describe("invitations", () => {
  it("e-mails a one-time link; accepting sets the password and the membership; the link then refuses a second use (410)", async () => {
    const email = `owner-rep-${suffix}@stillspan.test`;
    const { invitation, mail, token } = await invite(email, "viewer", "Ida Marrow");
    expect(invitation).toMatchObject({ email, role: "viewer", projectId: String(projectId) });
    expect(Date.parse(invitation.expiresAt) - Date.now()).toBeGreaterThan(71.9 * 3600_000);
    expect(mail.to).toEqual([email]);
    expect(mail.subject).toBe(`You are invited to Invitation test crossing ${suffix} on Stillspan`);
    expect(mail.text).toContain("Hello Ida Marrow,");
    expect(mail.html).toContain("/accept-invite?token=");
    // Only the SHA-256 of the token is stored.
    const [row] = await db.select().from(invitations).where(eq(invitations.id, Number(invitation.id)));
    expect(row.tokenSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(row.tokenSha256).not.toContain(token);

    const accepted = await api(base(), "/api/invitations/accept", { body: { token, password: "a-long-passphrase", name: "Ida Marrow" } });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    const me = await api(base(), "/api/auth/me", { cookie: await signIn(base(), email, "a-long-passphrase") });
    expect(me.body.memberships).toEqual([{ projectId: String(projectId), role: "viewer" }]);

    const again = await api(base(), "/api/invitations/accept", { body: { token, password: "another-passphrase", name: "Someone" } });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatchObject({ code: "link_used" });
    expect(again.body.error.message).toMatch(/already been used/);
    // The second attempt changed nothing.
    const res = await api(base(), "/api/auth/sign-in", { body: { email, password: "another-passphrase" } });
    expect(res.status).toBe(401);
  });

  it("refuses an expired link (410) and an unknown one (400), and a short password (400)", async () => {
    const email = `late-${suffix}@stillspan.test`;
    const { invitation, token } = await invite(email, "reviewer");
    const short = await api(base(), "/api/invitations/accept", { body: { token, password: "short", name: "Late Reviewer" } });
    expect(short.status).toBe(400);
    expect(short.body.error.message).toMatch(/password: must have at least 10 characters/);

    await db.update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(invitations.id, Number(invitation.id)));
    const expired = await api(base(), "/api/invitations/accept", { body: { token, password: "a-long-passphrase", name: "Late Reviewer" } });
    expect(expired.status).toBe(410);
    expect(expired.body.error).toMatchObject({ code: "link_expired" });
    expect(expired.body.error.message).toMatch(/expired/);

    const unknown = await api(base(), "/api/invitations/accept", { body: { token: "A".repeat(43), password: "a-long-passphrase", name: "X" } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.code).toBe("invalid_link");
    expect((await api(base(), "/api/auth/sign-in", { body: { email, password: "a-long-passphrase" } })).status).toBe(401);
  });

  it("lets only administrators invite (403 for an analyst, 401 without a session)", async () => {
    const body = { email: `nobody-${suffix}@stillspan.test`, role: "viewer" };
    expect((await api(base(), `/api/projects/${projectId}/invitations`, { cookie: analyst, body })).status).toBe(403);
    expect((await api(base(), `/api/projects/${projectId}/invitations`, { body })).status).toBe(401);
    const bad = await api(base(), `/api/projects/${projectId}/invitations`, { cookie: admin, body: { email: "not-an-address", role: "owner" } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(["email", "role"]);
  });
});

describe("password reset", () => {
  it("answers the same for a known and an unknown address, and e-mails only the known one", async () => {
    const email = `resetter-${suffix}@stillspan.test`;
    const { token } = await invite(email, "analyst");
    expect((await api(base(), "/api/invitations/accept", { body: { token, password: "first-passphrase", name: "Reset Tester" } })).status).toBe(200);

    const known = await api(base(), "/api/auth/password-reset", { body: { email } });
    const unknownEmail = `no-account-${suffix}@stillspan.test`;
    const unknown = await api(base(), "/api/auth/password-reset", { body: { email: unknownEmail } });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);

    const [mail] = await waitForMail(base(), admin, email, "Choose a new Stillspan password");
    expect(mail, "reset message").toBeDefined();
    expect(mail.to).toEqual([email]);
    expect(await waitForMail(base(), admin, unknownEmail, "password", { timeoutMs: 500 })).toEqual([]);

    const resetToken = tokenFrom(mail, "/reset-password");
    const confirmed = await api(base(), "/api/auth/password-reset/confirm", { body: { token: resetToken, password: "second-passphrase" } });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    const signedIn = await api(base(), "/api/auth/sign-in", { body: { email, password: "second-passphrase" } });
    expect(signedIn.status).toBe(200);
    expect(sessionCookieFrom(signedIn.headers)).toBeDefined();
    expect((await api(base(), "/api/auth/sign-in", { body: { email, password: "first-passphrase" } })).status).toBe(401);

    const reused = await api(base(), "/api/auth/password-reset/confirm", { body: { token: resetToken, password: "third-passphrase" } });
    expect(reused.status).toBe(410);
    expect(reused.body.error.code).toBe("link_used");
  });

  it("refuses an expired reset link (410)", async () => {
    const email = `resetter-late-${suffix}@stillspan.test`;
    const { token } = await invite(email, "analyst");
    await api(base(), "/api/invitations/accept", { body: { token, password: "first-passphrase", name: "Late Resetter" } });
    await api(base(), "/api/auth/password-reset", { body: { email } });
    const [mail] = await waitForMail(base(), admin, email, "Choose a new Stillspan password");
    const resetToken = tokenFrom(mail, "/reset-password");
    await db.execute(sql`update ${passwordResets} set expires_at = now() - interval '1 second' where used_at is null and user_id = (select id from users where email = ${email})`);
    const res = await api(base(), "/api/auth/password-reset/confirm", { body: { token: resetToken, password: "second-passphrase" } });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe("link_expired");
  });
});

describe("sessions after a password change", () => {
  const me = (cookie: string) => api(base(), "/api/auth/me", { cookie });

  it("ends sessions started before a password reset or an invitation that sets a new password; sign-ins after work", async () => {
    const email = `session-cut-${suffix}@stillspan.test`;
    const { token } = await invite(email, "analyst");
    expect((await api(base(), "/api/invitations/accept", { body: { token, password: "first-passphrase", name: "Cut Tester" } })).status).toBe(200);
    const beforeReset = await signIn(base(), email, "first-passphrase");
    expect((await me(beforeReset)).status).toBe(200);

    await api(base(), "/api/auth/password-reset", { body: { email } });
    const [resetMail] = await waitForMail(base(), admin, email, "Choose a new Stillspan password");
    const confirmed = await api(base(), "/api/auth/password-reset/confirm", {
      body: { token: tokenFrom(resetMail, "/reset-password"), password: "second-passphrase" },
    });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    expect((await me(beforeReset)).status, "session started before the reset").toBe(401);
    const afterReset = await signIn(base(), email, "second-passphrase");
    expect((await me(afterReset)).status, "session started right after the reset").toBe(200);

    // A second invitation to the now existing account: accepting it sets the password again.
    const second = await api(base(), `/api/projects/${projectId}/invitations`, { cookie: admin, body: { email, role: "reviewer" } });
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    const [latest] = await waitForMail(base(), admin, email, "You are invited to", { count: 2 });
    const accepted = await api(base(), "/api/invitations/accept", {
      body: { token: tokenFrom(latest, "/accept-invite"), password: "third-passphrase", name: "Cut Tester" },
    });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    expect((await me(afterReset)).status, "session started before the invitation was accepted").toBe(401);
    expect((await me(await signIn(base(), email, "third-passphrase"))).status).toBe(200);
  });
});
