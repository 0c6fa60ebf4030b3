// Per-device signing of the chain head. At first use each install makes an ECDSA P-256 key pair with
// WebCrypto (FIPS 186-5 ECDSA over the NIST P-256 curve, SHA-256), the private key non-extractable,
// and keeps both CryptoKeys in IndexedDB (structured clone keeps them opaque: the private key's bytes
// never reach JavaScript). Every save signs the new chain head, (deviceId, seq, hash) of the record
// saved, before its write transaction opens; the signature is stored beside the record's text in its
// block. Since each hash covers the one before it, a valid signature on seq n vouches for seq 1..n.
// Verification is in signatures.ts (loaded with the long jobs). BACKUP-FORMAT.md says what a
// signature does and does not prove.
import type { IDBPDatabase } from 'idb';
import type { DeviceKey, PublicJwk } from './records.ts';
import type { TanksideDB } from './schema.ts';
import { SETTING_SIGNING_KEY } from './schema.ts';
import { formatIsoWithOffset } from './time.ts';

export const SIGNING_ALGORITHM = { name: 'ECDSA', namedCurve: 'P-256' } as const;
export const SIGNATURE_PARAMS = { name: 'ECDSA', hash: 'SHA-256' } as const;

const UTF8 = new TextEncoder();

/**
 * The bytes a chain-head signature covers: UTF-8 of "tankside-chain-head", the device id, the seq
 * (decimal) and the record's hash, each on its own line. The first line keeps a signature made for
 * this from meaning anything elsewhere.
 */
export function chainHeadMessage(deviceId: string, seq: number, hash: string): Uint8Array<ArrayBuffer> {
  return UTF8.encode(`tankside-chain-head\n${deviceId}\n${seq}\n${hash}`);
}

/** Base64url without padding (RFC 4648 §5), as JWK and the backup's signatures use it. */
export function base64url(bytes: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < bytes.length; i += 1) binary += String.fromCharCode(bytes[i]!);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/** Signs a chain head with the device key: 64 bytes (r ‖ s, IEEE P1363, as WebCrypto gives them), base64url. */
export async function signChainHead(key: DeviceKey, deviceId: string, seq: number, hash: string): Promise<string> {
  const signature = await crypto.subtle.sign(SIGNATURE_PARAMS, key.privateKey, chainHeadMessage(deviceId, seq, hash));
  return base64url(new Uint8Array(signature));
}

const keys = new WeakMap<IDBPDatabase<TanksideDB>, Promise<DeviceKey | null>>();

/**
 * This install's signing key, made and stored at first use. Null where WebCrypto offers no ECDSA
 * P-256 or the key cannot be stored: the check is then saved unsigned (the reading matters more
 * than its signature) and verification reports the record as not covered. Made outside any
 * transaction; stored in one that re-reads first, so two tabs making one at once keep the same.
 */
export function deviceSigningKey(db: IDBPDatabase<TanksideDB>): Promise<DeviceKey | null> {
  let known = keys.get(db);
  if (!known) {
    known = loadOrMakeKey(db).catch(() => null);
    keys.set(db, known);
    // A failure is not remembered: the next save tries again.
    void known.then((k) => { if (k === null) keys.delete(db); });
  }
  return known;
}

async function loadOrMakeKey(db: IDBPDatabase<TanksideDB>): Promise<DeviceKey | null> {
  const stored = await db.get('settings', SETTING_SIGNING_KEY);
  if (isDeviceKey(stored)) return stored;
  const pair = await crypto.subtle.generateKey(SIGNING_ALGORITHM, false, ['sign', 'verify']);
  const jwk = await crypto.subtle.exportKey('jwk', pair.publicKey);
  const publicJwk: PublicJwk = { crv: 'P-256', kty: 'EC', x: String(jwk.x), y: String(jwk.y) };
  // Its fingerprint (RFC 7638) is worked out where it is shown (signatures.ts), not at start-up.
  const made: DeviceKey = { privateKey: pair.privateKey, publicKey: pair.publicKey, publicJwk, createdAt: formatIsoWithOffset(new Date()) };
  const tx = db.transaction('settings', 'readwrite', { durability: 'strict' });
  const keep = async (): Promise<DeviceKey> => {
    const again = await tx.store.get(SETTING_SIGNING_KEY);
    if (isDeviceKey(again)) return again;
    await tx.store.put(made, SETTING_SIGNING_KEY);
    return made;
  };
  const [kept] = await Promise.all([keep(), tx.done]);
  return kept;
}

function isDeviceKey(value: unknown): value is DeviceKey {
  const k = value as Partial<DeviceKey> | undefined;
  return typeof k === 'object' && k !== null && typeof k.publicJwk === 'object' && typeof k.privateKey === 'object' && k.privateKey !== null;
}
