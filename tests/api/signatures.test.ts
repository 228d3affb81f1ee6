import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { compactVerify, createLocalJWKSet } from "jose";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inventedSummary } from "../../shared/schemas/__tests__/fixtures/invented-summary-v2.js";
import { canonicalJson } from "../../shared/canonical-json.js";
import { loadConfig } from "../../server/config.js";
import { signStabilitySummary } from "../../server/services/signing.js";
import { KeyStore } from "../../server/signing/key-store.js";
import { signSummary } from "../../server/signing/sign-summary.js";
import { testEnv } from "../support/env.js";
import { api } from "../support/http.js";

const base = () => testEnv.baseUrl;
let jws: string;
let foreignDir: string;

beforeAll(async () => {
  // Signed with the app's own key folder (the same configuration the app child reads).
  jws = (await signStabilitySummary(loadConfig(), inventedSummary())).jws;
  foreignDir = mkdtempSync(path.join(tmpdir(), "stillspan-foreign-keys-"));
});
afterAll(() => rmSync(foreignDir, { recursive: true, force: true }));

describe("GET /.well-known/jwks.json", () => {
  it("publishes the public Ed25519 keys, without any private part, cacheable", async () => {
    const res = await api<{ keys: Record<string, string>[] }>(base(), "/.well-known/jwks.json");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("application/jwk-set+json");
    expect(res.headers.get("cache-control")).toBe("public, max-age=300");
    const doc = JSON.parse(res.body as unknown as string) as { keys: Record<string, string>[] };
    expect(doc.keys.length).toBeGreaterThanOrEqual(1);
    for (const key of doc.keys) {
      expect(key).toMatchObject({ kty: "OKP", crv: "Ed25519", alg: "EdDSA", use: "sig" });
      expect(key.kid).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(key).not.toHaveProperty("d");
    }
  });

  it("lets anyone verify a signed summary with jose and nothing but the published JWKS", async () => {
    const res = await fetch(`${base()}/.well-known/jwks.json`);
    const { payload } = await compactVerify(jws, createLocalJWKSet(await res.json()), { algorithms: ["EdDSA"] });
    expect(new TextDecoder().decode(payload)).toBe(canonicalJson(inventedSummary()));
  });
});

describe("POST /api/signatures/verify", () => {
  it("returns valid, the decoded summary, the key id and the verification code (no sign-in needed)", async () => {
    const res = await api(base(), "/api/signatures/verify", { body: { jws } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ valid: true, reason: null, current: null, summary: inventedSummary() });
    expect(res.body.kid).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(res.body.verificationCode).toMatch(/^[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}$/);
  });

  it("answers valid: false with a reason when one payload field was changed", async () => {
    const [header, , signature] = jws.split(".");
    const changed = inventedSummary();
    if (changed.assessment.flutter.found) changed.assessment.flutter.speedMps = 88.4;
    const forged = `${header}.${Buffer.from(canonicalJson(changed)).toString("base64url")}.${signature}`;
    const res = await api(base(), "/api/signatures/verify", { body: { jws: forged } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ valid: false, summary: null, reason: "the signature does not match the content" });
  });

  it("answers valid: false when the signature was changed", async () => {
    const [header, payload, signature] = jws.split(".");
    const bytes = Buffer.from(signature, "base64url");
    bytes[0] ^= 0x80;
    const res = await api(base(), "/api/signatures/verify", {
      body: { jws: `${header}.${payload}.${bytes.toString("base64url")}` },
    });
    expect(res.body).toMatchObject({ valid: false, summary: null });
  });

  it("answers valid: false for a signature re-spelt in the unused bits of its last character (same bytes, other text)", async () => {
    const [header, payload, signature] = jws.split(".");
    const alphabet = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_";
    // 64 bytes → 86 characters; the last one carries 2 bits of the signature and 4 unused bits.
    const respelt = signature.slice(0, -1) + alphabet[alphabet.indexOf(signature.at(-1)!) ^ 1];
    expect(Buffer.from(respelt, "base64url").equals(Buffer.from(signature, "base64url"))).toBe(true);
    const res = await api(base(), "/api/signatures/verify", { body: { jws: `${header}.${payload}.${respelt}` } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ valid: false, summary: null, current: null, summaryId: null });
    expect(res.body.reason).toMatch(/signature is not in canonical base64url/);
  });

  it("answers valid: false for a summary signed by a key this server never published", async () => {
    const foreign = await KeyStore.open({ dir: path.join(foreignDir, "keys") });
    const { jws: foreignJws, kid } = await signSummary(foreign, inventedSummary());
    const res = await api(base(), "/api/signatures/verify", { body: { jws: foreignJws } });
    expect(res.body).toMatchObject({ valid: false, kid, reason: `signed with key ${kid}, which is not in the JWKS` });
  });

  it("rejects a body without a compact JWS with 400 naming the field", async () => {
    for (const body of [{}, { jws: "not a jws" }, { jws: 42 }]) {
      const res = await api(base(), "/api/signatures/verify", { body });
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(res.body)).toContain("jws");
    }
  });
});
