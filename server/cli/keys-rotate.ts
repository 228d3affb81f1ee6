/**
 * `npm run keys:rotate`: makes a new current signing key in the key folder. Summaries signed with older keys keep
 * verifying: their public keys stay in the JWKS. A running server picks the new key up on its next signature.
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { ConfigError, loadConfig } from "../config.js";
import { KeyStore, KeyStoreError, keyStoreOptions } from "../signing/key-store.js";

async function main(): Promise<void> {
  const config = loadConfig();
  const firstKey = !config.signing.privateKey && !existsSync(path.join(config.signing.keysDir, "keyring.json"));
  const store = await KeyStore.open(keyStoreOptions(config.signing));
  if (firstKey) {
    console.log(`No signing key existed yet: created ${(await store.signingKey()).kid} in ${config.signing.keysDir}`);
    return;
  }
  const previous = (await store.signingKey()).kid;
  const next = await store.rotate();
  const jwks = await store.jwks();
  console.log(`Signing key rotated: ${previous} → ${next.kid}`);
  console.log(`The JWKS now lists ${jwks.keys.length} public key(s); older signatures still verify.`);
}

main().catch((err: unknown) => {
  if (err instanceof ConfigError || err instanceof KeyStoreError) {
    console.error(err.message);
    process.exit(2);
  }
  console.error(err);
  process.exit(1);
});
