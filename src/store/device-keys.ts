// The public keys the store knows, per device: this install's own (its signing key pair) and those
// of other devices, learnt from the signed backups they sent. Used by export (the file carries
// each device's key), import (a device's key never changes) and verification.
import type { IDBPDatabase, IDBPTransaction, StoreNames } from 'idb';
import type { KnownDeviceKey, PublicJwk } from './records.ts';
import { SETTING_DEVICE_ID, SETTING_DEVICE_KEY_PREFIX, SETTING_SIGNING_KEY, type TanksideDB } from './schema.ts';
import type { DeviceKey } from './records.ts';
import { jwkThumbprint } from './signatures.ts';

/** A device's public key as the store knows it. */
export interface StoredPublicKey {
  publicJwk: PublicJwk;
  fingerprint: string;
  /** Set for this install's own key: the CryptoKey to verify with, no import needed. */
  cryptoKey?: CryptoKey;
}

/** Any transaction whose scope includes settings. */
interface SettingsReader {
  objectStore(name: 'settings'): { get(key: string): Promise<unknown> };
}

/** The keys known for `deviceIds` (inside `tx`, which must cover settings); devices with none are left out. */
export async function storedPublicKeys(tx: SettingsReader, deviceIds: readonly string[]): Promise<Map<string, StoredPublicKey>> {
  const settings = tx.objectStore('settings');
  const [own, ownKey, others] = await Promise.all([
    settings.get(SETTING_DEVICE_ID),
    settings.get(SETTING_SIGNING_KEY),
    Promise.all(deviceIds.map((d) => settings.get(`${SETTING_DEVICE_KEY_PREFIX}${d}`))),
  ]);
  const out = new Map<string, StoredPublicKey>();
  deviceIds.forEach((d, i) => {
    const k = others[i] as KnownDeviceKey | undefined;
    if (k && typeof k === 'object' && typeof k.fingerprint === 'string') out.set(d, { publicJwk: k.publicJwk, fingerprint: k.fingerprint });
  });
  const mine = ownKey as DeviceKey | undefined;
  if (typeof own === 'string' && mine && typeof mine === 'object' && typeof mine.publicJwk === 'object') {
    out.set(own, { publicJwk: mine.publicJwk, fingerprint: await jwkThumbprint({ ...mine.publicJwk }), cryptoKey: mine.publicKey });
  }
  return out;
}

/** As storedPublicKeys, in a read-only transaction of its own. */
export function readPublicKeys(db: IDBPDatabase<TanksideDB>, deviceIds: readonly string[]): Promise<Map<string, StoredPublicKey>> {
  return storedPublicKeys(db.transaction('settings'), deviceIds);
}

/** Records another device's public key (inside an import's write transaction; IndexedDB requests only). */
export function learnPublicKey(tx: IDBPTransaction<TanksideDB, StoreNames<TanksideDB>[], 'readwrite'>, key: KnownDeviceKey): Promise<unknown> {
  return tx.objectStore('settings').put(key, `${SETTING_DEVICE_KEY_PREFIX}${key.deviceId}`);
}
