/**
 * The server's Ed25519 signing keys (jose). One current key signs; retired keys stay in the JWKS so summaries
 * signed before a rotation still verify.
 *
 * Two sources:
 * - a key folder (default <dataDir>/keys or STILLSPAN_KEYS_DIR, mode 0700): `keyring.json` lists every key's public JWK and which one is
 *   current; the current private key sits beside it as `<kid>.pkcs8.pem` (mode 0600). Generated on first use;
 *   `rotate()` adds a new key and deletes the retired private key (only its public half is ever needed again).
 * - the environment (production): STILLSPAN_SIGNING_KEY holds the private key as PKCS8 PEM or as a private JWK;
 *   STILLSPAN_SIGNING_RETIRED_JWKS optionally holds a JWKS document of retired public keys. Rotation then happens
 *   in the operator's secret store, not here.
 *
 * The key id is the RFC 7638 JWK thumbprint (SHA-256, base64url) of the public key.
 */
import { chmodSync, existsSync, mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import {
  calculateJwkThumbprint,
  exportJWK,
  exportPKCS8,
  generateKeyPair,
  importJWK,
  importPKCS8,
  type CryptoKey,
  type JWK,
} from "jose";
import { SUMMARY_JWS_ALG } from "../../shared/schemas/summary.js";

export const SIGNING_ALG = SUMMARY_JWS_ALG;

export interface PublicSigningJwk extends JWK {
  kty: "OKP";
  crv: "Ed25519";
  x: string;
  kid: string;
  alg: typeof SIGNING_ALG;
  use: "sig";
}

export interface SigningKey {
  kid: string;
  privateKey: CryptoKey;
  publicJwk: PublicSigningJwk;
}

export interface JwksDocument {
  keys: PublicSigningJwk[];
}

interface KeyringEntry {
  kid: string;
  createdAt: string;
  retiredAt: string | null;
  publicJwk: PublicSigningJwk;
}

interface Keyring {
  current: string;
  keys: KeyringEntry[];
}

export interface KeyStoreOptions {
  /** Key folder for generated keys; ignored when `envKey` is given. */
  dir: string;
  /** Private key from the environment: PKCS8 PEM or a private Ed25519 JWK (JSON). */
  envKey?: string;
  /** JWKS document (JSON) of retired public keys, used with `envKey`. */
  envRetiredJwks?: string;
  now?: () => Date;
}

export class KeyStoreError extends Error {
  override name = "KeyStoreError";
}

const KEYRING_FILE = "keyring.json";

async function publicJwkOf(privateKey: CryptoKey): Promise<PublicSigningJwk> {
  const jwk = await exportJWK(privateKey);
  if (jwk.kty !== "OKP" || jwk.crv !== "Ed25519" || typeof jwk.x !== "string") {
    throw new KeyStoreError("the signing key must be an Ed25519 key (kty OKP, crv Ed25519)");
  }
  const bare = { kty: "OKP", crv: "Ed25519", x: jwk.x } as const;
  const kid = await calculateJwkThumbprint(bare, "sha256");
  return { ...bare, kid, alg: SIGNING_ALG, use: "sig" };
}

/** Parses a private key given as PKCS8 PEM or as a private JWK; the message says which form failed and why. */
export async function importPrivateKey(text: string): Promise<SigningKey> {
  const trimmed = text.trim();
  let privateKey: CryptoKey;
  try {
    if (trimmed.startsWith("{")) {
      const jwk = JSON.parse(trimmed) as JWK;
      if (!jwk.d) throw new Error('the JWK has no private part ("d")');
      const imported = await importJWK({ ...jwk, alg: SIGNING_ALG }, SIGNING_ALG, { extractable: true });
      if (imported instanceof Uint8Array) throw new Error("the JWK is a symmetric key");
      privateKey = imported;
    } else {
      privateKey = await importPKCS8(trimmed.replace(/\\n/g, "\n"), SIGNING_ALG, { extractable: true });
    }
  } catch (cause) {
    const form = trimmed.startsWith("{") ? "a private JWK" : "PKCS8 PEM";
    throw new KeyStoreError(`STILLSPAN_SIGNING_KEY is not a usable Ed25519 key (${form}): ${(cause as Error).message}`);
  }
  const publicJwk = await publicJwkOf(privateKey);
  return { kid: publicJwk.kid, privateKey, publicJwk };
}

/** A new Ed25519 key pair with its thumbprint key id. */
export async function generateSigningKey(): Promise<SigningKey> {
  const { privateKey } = await generateKeyPair(SIGNING_ALG, { crv: "Ed25519", extractable: true });
  const publicJwk = await publicJwkOf(privateKey);
  return { kid: publicJwk.kid, privateKey, publicJwk };
}

function writePrivateFile(file: string, content: string): void {
  const tmp = `${file}.${process.pid}.tmp`;
  writeFileSync(tmp, content, { mode: 0o600 });
  chmodSync(tmp, 0o600);
  renameSync(tmp, file);
}

export class KeyStore {
  private keyring: Keyring | null = null;
  private current: SigningKey | null = null;
  private readonly now: () => Date;

  private constructor(
    private readonly options: KeyStoreOptions,
    private readonly envKey: SigningKey | null,
    private readonly envRetired: PublicSigningJwk[],
  ) {
    this.now = options.now ?? (() => new Date());
  }

  /** Opens the store; with a key folder, creates the folder and a first key when there is none yet. */
  static async open(options: KeyStoreOptions): Promise<KeyStore> {
    if (options.envKey) {
      const key = await importPrivateKey(options.envKey);
      const retired = options.envRetiredJwks ? await parseRetiredJwks(options.envRetiredJwks) : [];
      return new KeyStore(options, key, retired);
    }
    const store = new KeyStore(options, null, []);
    mkdirSync(options.dir, { recursive: true, mode: 0o700 });
    chmodSync(options.dir, 0o700);
    if (!existsSync(store.keyringPath)) await store.rotate();
    await store.reload();
    return store;
  }

  get source(): "environment" | "folder" {
    return this.envKey ? "environment" : "folder";
  }

  private get keyringPath(): string {
    return path.join(this.options.dir, KEYRING_FILE);
  }

  /**
   * Re-reads keyring.json (small) on every use, so a rotation by another process (`npm run keys:rotate`) takes
   * effect without a restart; the private key is imported again only when the current key id changed.
   */
  private async reload(): Promise<void> {
    if (this.envKey) return;
    const keyring = JSON.parse(readFileSync(this.keyringPath, "utf8")) as Keyring;
    if (this.current?.kid !== keyring.current) {
      const pemFile = path.join(this.options.dir, `${keyring.current}.pkcs8.pem`);
      if (!existsSync(pemFile)) {
        throw new KeyStoreError(`the current signing key's private file is missing: ${pemFile}`);
      }
      const key = await importPrivateKey(readFileSync(pemFile, "utf8"));
      if (key.kid !== keyring.current) {
        throw new KeyStoreError(`${pemFile} holds key ${key.kid}, but keyring.json names ${keyring.current}`);
      }
      this.current = key;
    }
    this.keyring = keyring;
  }

  /** The key that signs now. */
  async signingKey(): Promise<SigningKey> {
    if (this.envKey) return this.envKey;
    await this.reload();
    return this.current!;
  }

  /** Public keys for verification: the current one first, then the retired ones (newest first). */
  async jwks(): Promise<JwksDocument> {
    if (this.envKey) return { keys: [this.envKey.publicJwk, ...this.envRetired] };
    await this.reload();
    const { current, keys } = this.keyring!;
    const retired = keys.filter((e) => e.kid !== current).sort((a, b) => b.createdAt.localeCompare(a.createdAt));
    return { keys: [this.current!.publicJwk, ...retired.map((e) => e.publicJwk)] };
  }

  /**
   * Makes a new current key; the previous one is retired: its public JWK stays in the keyring, its private
   * file is deleted. Refused when the key comes from the environment.
   */
  async rotate(): Promise<SigningKey> {
    if (this.envKey) {
      throw new KeyStoreError(
        "the signing key comes from STILLSPAN_SIGNING_KEY: rotate it in the secret store and add the old public " +
          "key to STILLSPAN_SIGNING_RETIRED_JWKS",
      );
    }
    const key = await generateSigningKey();
    const at = this.now().toISOString();
    const previous: Keyring | null = existsSync(this.keyringPath)
      ? (JSON.parse(readFileSync(this.keyringPath, "utf8")) as Keyring)
      : null;
    const keys = (previous?.keys ?? []).map((e) => (e.retiredAt ? e : { ...e, retiredAt: at }));
    keys.push({ kid: key.kid, createdAt: at, retiredAt: null, publicJwk: key.publicJwk });
    writePrivateFile(path.join(this.options.dir, `${key.kid}.pkcs8.pem`), await exportPKCS8(key.privateKey));
    writePrivateFile(this.keyringPath, `${JSON.stringify({ current: key.kid, keys }, null, 2)}\n`);
    if (previous) rmSync(path.join(this.options.dir, `${previous.current}.pkcs8.pem`), { force: true });
    await this.reload();
    return key;
  }
}

async function parseRetiredJwks(text: string): Promise<PublicSigningJwk[]> {
  const name = "STILLSPAN_SIGNING_RETIRED_JWKS";
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (cause) {
    throw new KeyStoreError(`${name} is not JSON: ${(cause as Error).message}`);
  }
  const keys = (doc as { keys?: unknown } | null)?.keys;
  if (!Array.isArray(keys)) throw new KeyStoreError(`${name} must be a JWKS document: {"keys": [...]}`);
  return Promise.all(
    keys.map(async (k: JWK, i) => {
      if (k.kty !== "OKP" || k.crv !== "Ed25519" || typeof k.x !== "string" || k.d !== undefined) {
        throw new KeyStoreError(`${name} keys[${i}] must be a public Ed25519 JWK (kty OKP, crv Ed25519, x)`);
      }
      const bare = { kty: "OKP", crv: "Ed25519", x: k.x } as const;
      const kid = await calculateJwkThumbprint(bare, "sha256");
      if (k.kid !== undefined && k.kid !== kid) {
        throw new KeyStoreError(`${name} keys[${i}]: kid ${k.kid} is not the key's RFC 7638 thumbprint ${kid}`);
      }
      return { ...bare, kid, alg: SIGNING_ALG, use: "sig" } satisfies PublicSigningJwk;
    }),
  );
}

/** Store options from the parsed configuration (`Config["signing"]`). */
export function keyStoreOptions(signing: {
  keysDir: string;
  privateKey?: string;
  retiredJwks?: string;
}): KeyStoreOptions {
  return { dir: signing.keysDir, envKey: signing.privateKey, envRetiredJwks: signing.retiredJwks };
}
