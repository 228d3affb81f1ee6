/**
 * The server's use of summary signatures: one key store per process (opened on first use, or at start by
 * `ensureSigningKey` so the key exists before the demo seed signs anything), signing, verification, the JWKS.
 */
import type { Config } from "../config.js";
import type { SummaryPayload } from "../../shared/schemas/summary.js";
import { KeyStore, keyStoreOptions, type JwksDocument } from "../signing/key-store.js";
import { signSummary, type SignedSummary } from "../signing/sign-summary.js";
import { verificationCode } from "../signing/verification-code.js";
import { verifySummary, type SummaryVerification } from "../signing/verify-summary.js";

const stores = new Map<string, Promise<KeyStore>>();

/** The key store of this configuration (one per key folder or environment key, shared by every request). */
export function keyStoreFor(config: Pick<Config, "signing">): Promise<KeyStore> {
  const id = config.signing.privateKey ? `env:${config.signing.privateKey}` : `dir:${config.signing.keysDir}`;
  let store = stores.get(id);
  if (!store) {
    store = KeyStore.open(keyStoreOptions(config.signing));
    stores.set(id, store);
    store.catch(() => stores.delete(id)); // a failed open is retried on the next call
  }
  return store;
}

/** Opens (and on first start creates) the signing key; returns its key id and where it comes from. */
export async function ensureSigningKey(config: Pick<Config, "signing">): Promise<{ kid: string; source: string }> {
  const store = await keyStoreFor(config);
  return { kid: (await store.signingKey()).kid, source: store.source };
}

export async function publicJwks(config: Pick<Config, "signing">): Promise<JwksDocument> {
  return (await keyStoreFor(config)).jwks();
}

/** Signs a summary with the current key. The result's `summary` is exactly what was signed. */
export async function signStabilitySummary(
  config: Pick<Config, "signing">,
  summary: SummaryPayload,
): Promise<SignedSummary & { verificationCode: string }> {
  const signed = await signSummary(await keyStoreFor(config), summary);
  return { ...signed, verificationCode: verificationCode(signed.jws) };
}

/** Verifies a JWS against this server's published keys (current and retired). */
export async function verifyStabilitySummary(
  config: Pick<Config, "signing">,
  jws: string,
): Promise<SummaryVerification> {
  return verifySummary(jws, await publicJwks(config));
}
