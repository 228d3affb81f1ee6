import { SignJWT, UnsecuredJWT } from "jose";
import { describe, expect, it } from "vitest";
import { createSessionToken, readSessionToken, SESSION_TTL_SECONDS } from "../auth.js";

const secret = new TextEncoder().encode("0123456789abcdef0123456789abcdef");

describe("session tokens", () => {
  it("round-trips the user id, with a fresh session id per token and the 12 h expiry", async () => {
    const now = new Date();
    const a = await readSessionToken(secret, await createSessionToken(secret, 42, now));
    const b = await readSessionToken(secret, await createSessionToken(secret, 42, now));
    expect(a?.userId).toBe(42);
    expect(a?.jti).toMatch(/^[0-9a-f-]{36}$/);
    expect(b?.jti).not.toBe(a?.jti);
    expect(a!.expiresAt.getTime()).toBe(Math.floor(now.getTime() / 1000) * 1000 + SESSION_TTL_SECONDS * 1000);
  });

  it("expires 12 h after issue", async () => {
    expect(SESSION_TTL_SECONDS).toBe(12 * 3600);
    const justValid = await createSessionToken(secret, 7, new Date(Date.now() - (SESSION_TTL_SECONDS - 60) * 1000));
    const expired = await createSessionToken(secret, 7, new Date(Date.now() - (SESSION_TTL_SECONDS + 60) * 1000));
    expect((await readSessionToken(secret, justValid))?.userId).toBe(7);
    expect(await readSessionToken(secret, expired)).toBeUndefined();
  });

  it("rejects another secret, an unsigned token and a token for another audience", async () => {
    const other = new TextEncoder().encode("another-secret-another-secret-123");
    const unsigned = new UnsecuredJWT({}).setSubject("1").setJti("x").setIssuer("stillspan").setAudience("stillspan-session").encode();
    const otherAudience = await new SignJWT({})
      .setProtectedHeader({ alg: "HS256" })
      .setSubject("1")
      .setJti("x")
      .setIssuer("stillspan")
      .setAudience("somewhere-else")
      .setExpirationTime("1h")
      .sign(secret);

    expect(await readSessionToken(secret, await createSessionToken(other, 1))).toBeUndefined();
    expect(await readSessionToken(secret, unsigned)).toBeUndefined();
    expect(await readSessionToken(secret, otherAudience)).toBeUndefined();
    expect(await readSessionToken(secret, "not-a-token")).toBeUndefined();
    const withoutSessionId = await new SignJWT({})
      .setProtectedHeader({ alg: "HS256" })
      .setSubject("1")
      .setIssuer("stillspan")
      .setAudience("stillspan-session")
      .setExpirationTime("1h")
      .sign(secret);
    expect(await readSessionToken(secret, withoutSessionId)).toBeUndefined();
  });
});
