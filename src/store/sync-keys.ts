// Device keys over plant sync. Each device writes its public key once, at enrolment, as the
// record at seq 0 of its chain on the server ("<deviceId>:0000000000", type "device-key"); a
// supervisor's pull learns each device's key from it before it merges that device's signed
// records, so verification after a pull says "signed by device …". A device's key never changes:
// one that differs from the key already known for its device is refused, never learnt over it
// (the same rule as a backup import's, backup.ts deviceSigning).
import { validatePublicKey } from './backup-format.ts';
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { canonicalJson } from './integrity.ts';
import type { KnownDeviceKey, PublicJwk } from './records.ts';
import { SETTING_DEVICE_ID, SETTING_DEVICE_KEY_PREFIX } from './schema.ts';
import { deviceId } from './settings.ts';
import { jwkThumbprint } from './signatures.ts';
import { deviceSigningKey } from './signing.ts';
import { formatIsoWithOffset } from './time.ts';
import { requireUuid } from './validate.ts';

/** The device-key record at seq 0 of a device's chain on the plant server. */
export interface DeviceKeyRecord {
  kind: 'device-key';
  deviceId: string;
  seq: 0;
  publicJwk: PublicJwk;
  /** When the device made its key (the key's own createdAt, so the text is the same at every sync). */
  createdAt: string;
}

/**
 * This install's device-key record as canonical JSON (the same text every time), or null where
 * WebCrypto gives this install no signing key (its checks are then saved, and sent, unsigned).
 */
export async function ownDeviceKeyText(): Promise<string | null> {
  const db = await getDb();
  const [key, device] = await Promise.all([deviceSigningKey(db), deviceId()]);
  if (!key) return null;
  const record: DeviceKeyRecord = { kind: 'device-key', deviceId: device, seq: 0, publicJwk: key.publicJwk, createdAt: key.createdAt };
  return canonicalJson(record);
}

/** What learnDeviceKeys did. */
export interface KeyLearnReport {
  /** Devices whose key was learnt now. */
  learnt: string[];
  /** Key records not taken, by label, and why (not a key, or another key is known for the device). */
  refused: { label: string; why: string }[];
}

/**
 * Keeps the public keys of other devices read from their device-key records (pulled from the
 * plant server), so their signed records verify; one already known and equal is skipped, one that
 * differs is refused. This install's own record is skipped (its key is its own). One strict
 * transaction; nothing else is awaited inside it.
 * @throws StoreError('quota-exceeded' | 'write-failed')
 */
export async function learnDeviceKeys(pulled: readonly { label: string; text: string }[]): Promise<KeyLearnReport> {
  const report: KeyLearnReport = { learnt: [], refused: [] };
  const candidates: KnownDeviceKey[] = [];
  const learntAt = formatIsoWithOffset(new Date());
  for (const { label, text } of pulled) {
    const parsed = keyOfText(text);
    if (typeof parsed === 'string') report.refused.push({ label, why: parsed });
    else candidates.push({ deviceId: parsed.deviceId, publicJwk: parsed.publicJwk, fingerprint: await jwkThumbprint({ ...parsed.publicJwk }), learntAt });
  }
  if (candidates.length === 0) return report;
  const db = await getDb();
  const tx = db.transaction('settings', 'readwrite', { durability: 'strict' });
  const work = async () => {
    const [own, known] = await Promise.all([
      tx.store.get(SETTING_DEVICE_ID),
      Promise.all(candidates.map((k) => tx.store.get(`${SETTING_DEVICE_KEY_PREFIX}${k.deviceId}`))),
    ]);
    const writes: Promise<unknown>[] = [];
    candidates.forEach((k, i) => {
      if (k.deviceId === own) return;
      const here = known[i] as KnownDeviceKey | undefined;
      if (here && typeof here === 'object') {
        if (here.fingerprint !== k.fingerprint) {
          report.refused.push({
            label: k.deviceId,
            why: `the server gives device ${k.deviceId.slice(0, 8)} the key with fingerprint ${k.fingerprint}, but the key known here is ${here.fingerprint}`,
          });
        }
        return;
      }
      writes.push(tx.store.put(k, `${SETTING_DEVICE_KEY_PREFIX}${k.deviceId}`));
      report.learnt.push(k.deviceId);
    });
    await Promise.all(writes);
  };
  try {
    await Promise.all([work(), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, 'Saving the devices\' keys');
  }
  return report;
}

/** The device-key record in `text`, or why it is not one. */
function keyOfText(text: string): DeviceKeyRecord | string {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return 'the text is not JSON';
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return 'the text is not a JSON object';
  const v = value as Record<string, unknown>;
  const keys = ['createdAt', 'deviceId', 'kind', 'publicJwk', 'seq'];
  for (const key of Object.keys(v)) if (!keys.includes(key)) return `${key}: unknown field`;
  if (v['kind'] !== 'device-key' || v['seq'] !== 0) return 'kind: expected "device-key" at seq 0';
  try {
    requireUuid('deviceId', v['deviceId']);
    const publicJwk = validatePublicKey('publicJwk', v['publicJwk']);
    if (publicJwk === null) return 'publicJwk: expected a P-256 public key';
    if (typeof v['createdAt'] !== 'string') return 'createdAt: expected an ISO 8601 date-time';
    if (canonicalJson(value) !== text) return 'the text is not in canonical form';
    return { kind: 'device-key', deviceId: v['deviceId'] as string, seq: 0, publicJwk, createdAt: v['createdAt'] };
  } catch (error) {
    if (error instanceof StoreError) return error.message.replace(/^Backup file not imported, nothing changed\. /, '');
    throw error;
  }
}
