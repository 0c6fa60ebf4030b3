// Per-device signing: the primitives against published vectors, the device key kept inside WebCrypto,
// every save signed, and what verification and import make of an untouched chain, an edited and
// re-hashed one, a stripped signature, another key, an older (v1) file and a record of another kind.
import { describe, expect, it } from 'vitest';
import { IDBFactory } from 'fake-indexeddb';
import { computeCheckHash, StoreError, type CheckRecord } from '../../src/store/index.ts';
import { exportBackup, importBackup, verifyStoredChains } from '../../src/store/transfer.ts';
import { getDb } from '../../src/store/connection.ts';
import { deviceSigningKey, SIGNING_ALGORITHM, signChainHead, base64url } from '../../src/store/signing.ts';
import { jwkThumbprint, verifyP256, verifyingKey } from '../../src/store/signatures.ts';
import { SETTING_SIGNING_KEY } from '../../src/store/schema.ts';
import type { LogBlock } from '../../src/store/log-layout.ts';
import type { DeviceKey } from '../../src/store/records.ts';
import { dump, makeDeviceWithBackup, seedDevice, useDevice } from './backup-fixtures.ts';
import { editStored } from './log-access.ts';

const UTF8 = new TextEncoder();
const hexBytes = (hex: string) => Uint8Array.from(hex.match(/../g)!.map((b) => parseInt(b, 16)));

interface Doc {
  formatVersion: number;
  checks: (CheckRecord & Record<string, unknown>)[];
  signatures: { deviceId: string; seq: number; signature: string }[];
  chains: { deviceId: string; count: number; headSeq: number; headHash: string; publicKey: unknown }[];
  [k: string]: unknown;
}

/** Changes record `index` of the file's chain and re-hashes it and every record after it, as someone covering an edit would. */
async function editAndRehash(doc: Doc, index: number, change: (r: CheckRecord) => void): Promise<void> {
  change(doc.checks[index]!);
  for (let i = index; i < doc.checks.length; i += 1) {
    const r = doc.checks[i]!;
    if (i > 0) r.prevHash = doc.checks[i - 1]!.hash;
    const { hash: _h, ...content } = r;
    r.hash = await computeCheckHash(content as Omit<CheckRecord, 'hash'>);
  }
  const last = doc.checks.at(-1)!;
  doc.chains = doc.chains.map((c) => (c.deviceId === last.deviceId ? { ...c, headHash: last.hash } : c));
}

describe('signing primitives against published vectors', () => {
  it('computes the RFC 7638 §3.1 JWK thumbprint of its example key', async () => {
    // RFC 7638 (JSON Web Key Thumbprint), section 3.1, the RSA key of its example and its thumbprint.
    const n = '0vx7agoebGcQSuuPiLJXZptN9nndrQmbXEps2aiAFbWhM78LhWx4cbbfAAtVT86zwu1RK7aPFFxuhDR1L6tSoc_BJECPebWKRXjBZCiFV4n3oknjhMstn64tZ_2W-5JsGY4Hc5n9yBXArwl93lqt7_RN5w6Cf0h4QyQ5v-65YGjQR0_FDW2QvzqY368QQMicAtaSqzs8KJZgnYb9c7d0zgdAZHzu6qMQvRL5hajrn1n91CbOpbISD08qNLyrdkt-bFTWhAI4vMQFh6WeZu0fM4lFd2NcRwr3XPksINHaQ-G_xBniIqbw0Ls1jF44-csFCur-kEgU8awapJzKnqDKgw';
    expect(await jwkThumbprint({ kty: 'RSA', n, e: 'AQAB', alg: 'RS256', kid: '2011-04-29' })).toBe('NzbLsXh8uDCcd-6MNwXF4W_7noWXFZAfHkxZsRGC9Xs');
  });

  it('verifies the RFC 6979 A.2.5 ECDSA P-256 / SHA-256 signature of "sample", and refuses it for another message', async () => {
    // RFC 6979 (deterministic DSA and ECDSA), appendix A.2.5: the P-256 public key U and, for SHA-256
    // and message "sample", the signature (r, s).
    const ux = '60FED4BA255A9D31C961EB74C6356D68C049B8923B61FA6CE669622E60F29FB6';
    const uy = '7903FE1008B8BC99A41AE9E95628BC64F2F1B20C2D7E9F5177A3C294D4462299';
    const r = 'EFD48B2AACB6A8FD1140DD9CD45E81D69D2C877B56AAF991C34D0EA84EAF3716';
    const s = 'F7CB1C942D657C41D436C7A1B6E29F65F3E900DBB9AFF4064DC4AB2F843ACDA8';
    const key = await verifyingKey({ crv: 'P-256', kty: 'EC', x: base64url(hexBytes(ux)), y: base64url(hexBytes(uy)) });
    const signature = base64url(hexBytes(r + s));
    expect(await verifyP256(key.key, UTF8.encode('sample'), signature)).toBe(true);
    expect(await verifyP256(key.key, UTF8.encode('samplf'), signature)).toBe(false);
    expect(await verifyP256(key.key, UTF8.encode('sample'), signature.slice(0, -2) + 'AA')).toBe(false);
    expect(await verifyP256(key.key, UTF8.encode('sample'), 'not base64url!')).toBe(false);
  });
});

describe('the device key', () => {
  it('is made once, kept in IndexedDB, and its private half never leaves WebCrypto (extractable: false)', async () => {
    await useDevice(new IDBFactory());
    const db = await getDb();
    const key = (await deviceSigningKey(db))!;
    expect(key.privateKey.extractable).toBe(false);
    expect(key.privateKey.usages).toEqual(['sign']);
    expect(key.privateKey.algorithm).toMatchObject(SIGNING_ALGORITHM);
    await expect(crypto.subtle.exportKey('jwk', key.privateKey)).rejects.toThrow();
    await expect(crypto.subtle.exportKey('pkcs8', key.privateKey)).rejects.toThrow();
    // What the store holds is the same opaque key, not its bytes.
    const stored = (await db.get('settings', SETTING_SIGNING_KEY)) as DeviceKey;
    expect(stored.privateKey.extractable).toBe(false);
    expect(stored.publicJwk).toEqual(key.publicJwk);
    // A later open finds the same key.
    await useDevice(globalThis.indexedDB as IDBFactory);
    expect((await deviceSigningKey(await getDb()))!.publicJwk).toEqual(key.publicJwk);
  });
});

describe('verifying the stored log', () => {
  it('an untouched chain is signed by this device through its last record', async () => {
    await useDevice(new IDBFactory());
    await seedDevice(6);
    const fingerprint = await jwkThumbprint({ ...(await deviceSigningKey(await getDb()))!.publicJwk });
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', count: 7, signature: { state: 'signed', fingerprint, throughSeq: 7, headSeq: 7 } }]);
  });

  for (const edited of [1, 5, 12]) {
    it(`a record edited in place and the chain re-hashed after it (seq ${edited} of 12): the links hold, the signatures fail from seq ${edited}`, async () => {
      await useDevice(new IDBFactory());
      await seedDevice(11);
      const records = (await dump()).checks.sort((a, b) => a.seq - b.seq);
      let prev = edited > 1 ? records[edited - 2]!.hash : '0'.repeat(64);
      for (const r of records.slice(edited - 1)) {
        const changed = { ...r, prevHash: prev, note: r.seq === edited ? 'rewritten' : r.note };
        const { hash: _h, ...content } = changed;
        const hash = await computeCheckHash(content);
        await editStored(r.id, () => ({ ...changed, hash }));
        prev = hash;
      }
      const [chain] = await verifyStoredChains();
      expect(chain).toMatchObject({ status: 'ok', count: 12 });
      expect(chain!.signature).toMatchObject({ state: 'failed', throughSeq: edited - 1, at: { seq: edited, id: records[edited - 1]!.id } });
      if (chain!.signature.state === 'failed') expect(chain!.signature.detail).toMatch(/signature does not verify/);
    });
  }

  it('a record with no signature after the signed ones is vouched for by none: the chain says so, and an import refuses it', async () => {
    const source = await makeDeviceWithBackup(3);
    const db = await getDb();
    const [block] = (await db.getAll('logBlocks')) as LogBlock[];
    block!.sigs![block!.sigs!.length - 1] = '';
    await db.put('logBlocks', block!);
    // Stored: signed up to seq 3, seq 4 without one (as a record pulled by plant sync arrives).
    expect((await verifyStoredChains())[0]!.signature).toMatchObject({ state: 'signed', throughSeq: 3, headSeq: 4 });
    // In a file, for a device that signs: the unsigned record refuses the file.
    const doc = JSON.parse(source.backup) as Doc;
    doc.signatures = doc.signatures.filter((s) => s.seq !== 4);
    await useDevice(new IDBFactory());
    const error = (await importBackup(JSON.stringify(doc)).catch((e: unknown) => e)) as StoreError;
    expect(error.refused).toEqual([expect.objectContaining({ seq: 4, why: expect.stringMatching(/seq 4 carries no signature that vouches for it/) })]);
  });
});

describe('signed backups', () => {
  it('carry the public key and every signature; another device learns the key and verifies the same', async () => {
    const source = await makeDeviceWithBackup(4);
    const fingerprint = await jwkThumbprint({ ...(await deviceSigningKey(await getDb()))!.publicJwk });
    const doc = JSON.parse(source.backup) as Doc;
    expect(doc.formatVersion).toBe(4);
    expect(doc.signatures.map((s) => s.seq)).toEqual([1, 2, 3, 4, 5]);
    expect(doc.chains[0]!.publicKey).toMatchObject({ crv: 'P-256', kty: 'EC' });
    await useDevice(new IDBFactory());
    const report = await importBackup(source.backup);
    expect(report.fileSignatures).toEqual([{ deviceId: doc.chains[0]!.deviceId, signature: { state: 'signed', fingerprint, throughSeq: 5, headSeq: 5 } }]);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', signature: { state: 'signed', fingerprint, throughSeq: 5 } }]);
    // Exported again from here: the same records, signatures and key.
    expect((await exportBackup()).replace(/"exportedAt":"[^"]*"/, '')).toBe(source.backup.replace(/"exportedAt":"[^"]*"/, ''));
  });

  it('an edited and re-hashed chain in a file is refused, listing every record no valid signature vouches for', async () => {
    const source = await makeDeviceWithBackup(6);
    const doc = JSON.parse(source.backup) as Doc;
    await editAndRehash(doc, 3, (r) => void (r.technician = 'Someone Else'));
    await useDevice(new IDBFactory());
    const before = await dump();
    const error = (await importBackup(JSON.stringify(doc)).catch((e: unknown) => e)) as StoreError;
    expect(error).toBeInstanceOf(StoreError);
    expect(error.refused.map((r) => r.seq)).toEqual([4, 5, 6, 7]);
    expect(error.refused[0]!.why).toMatch(/seq 4: its signature does not verify/);
    expect(error.refused[1]!.why).toMatch(/no valid signature .* vouches for it \(they fail from seq 4\)/);
    expect(await dump()).toEqual(before);
    // The untouched file imports.
    expect((await importBackup(source.backup)).checks.added).toHaveLength(7);
  });

  it('an older (format version 1) file still imports, unsigned', async () => {
    const source = await makeDeviceWithBackup(3);
    const doc = JSON.parse(source.backup) as Doc;
    const v1 = {
      format: 'tankside-backup', formatVersion: 1, exportedAt: doc['exportedAt'], vessels: doc['vessels'], checks: doc.checks,
      chains: doc.chains.map(({ publicKey: _k, ...head }) => head),
    };
    await useDevice(new IDBFactory());
    const report = await importBackup(JSON.stringify(v1));
    expect(report.checks.added).toHaveLength(4);
    expect(report.fileSignatures).toMatchObject([{ signature: { state: 'unsigned' } }]);
    expect(await verifyStoredChains()).toMatchObject([{ status: 'ok', signature: { state: 'unsigned' } }]);
    // Its signed version later adds nothing but the key: every record is here already.
    expect((await importBackup(source.backup)).checks.skipped).toHaveLength(4);
  });

  it('a chain re-signed with another key imports on a fresh device under that key\'s fingerprint, and is refused where the real key is known', async () => {
    const source = await makeDeviceWithBackup(3);
    const doc = JSON.parse(source.backup) as Doc;
    const genuine = doc.chains[0]!.publicKey as Record<string, string>;
    const other = await crypto.subtle.generateKey(SIGNING_ALGORITHM, true, ['sign', 'verify']);
    const jwk = await crypto.subtle.exportKey('jwk', other.publicKey);
    const forged = { privateKey: other.privateKey, publicKey: other.publicKey, publicJwk: { crv: 'P-256' as const, kty: 'EC' as const, x: jwk.x!, y: jwk.y! }, createdAt: '', fingerprint: '' };
    forged.fingerprint = await jwkThumbprint({ ...forged.publicJwk });
    doc.chains[0]!.publicKey = forged.publicJwk;
    doc.signatures = await Promise.all(doc.checks.map(async (c) => ({ deviceId: c.deviceId, seq: c.seq, signature: await signChainHead(forged, c.deviceId, c.seq, c.hash) })));
    const text = JSON.stringify(doc);
    // A device that never saw the genuine key takes it: what a signature cannot prove (BACKUP-FORMAT.md).
    await useDevice(new IDBFactory());
    expect((await importBackup(text)).fileSignatures[0]!.signature).toMatchObject({ state: 'signed', fingerprint: forged.fingerprint });
    expect(forged.fingerprint).not.toBe(await jwkThumbprint(genuine));
    // The device the records came from knows its own key, and refuses the other.
    await useDevice(source.factory);
    const error = (await importBackup(text).catch((e: unknown) => e)) as StoreError;
    expect(error).toBeInstanceOf(StoreError);
    // Every record is here already; the key alone refuses the file.
    expect(error.refused).toEqual([expect.objectContaining({ seq: 1, id: '', why: expect.stringMatching(new RegExp(`the file gives device .* the key with fingerprint ${forged.fingerprint}, but its records here are signed with the key`)) })]);
  });

  it('a record of a kind this version does not keep is checked as a link of its chain, skipped and counted', async () => {
    const source = await makeDeviceWithBackup(2);
    const db = await getDb();
    const key = (await deviceSigningKey(db))!;
    const doc = JSON.parse(source.backup) as Doc;
    const last = doc.checks.at(-1)!;
    const content = { deviceId: last.deviceId, id: '7d9e3a52-1c4b-4e8f-9a6d-2b5c8e1f0a3d', kind: 'calibration-note', prevHash: last.hash, seq: last.seq + 1, note: { text: 'invented' } };
    const hash = await computeCheckHash(content as unknown as CheckRecord);
    (doc.checks as unknown[]).push({ ...content, hash });
    doc.signatures.push({ deviceId: last.deviceId, seq: content.seq, signature: await signChainHead(key, last.deviceId, content.seq, hash) });
    doc.chains[0] = { ...doc.chains[0]!, count: doc.chains[0]!.count + 1, headSeq: content.seq, headHash: hash };
    await useDevice(new IDBFactory());
    const report = await importBackup(JSON.stringify(doc));
    expect(report.checks.added).toHaveLength(3);
    expect(report.skippedKinds).toEqual({ 'calibration-note': 1 });
    expect(report.warnings).toEqual([expect.stringMatching(/Skipped 1 record of kind "calibration-note"/)]);
    expect(report.fileSignatures[0]!.signature).toMatchObject({ state: 'signed', throughSeq: content.seq });
    // Changed after it was hashed, the same record refuses the file.
    (doc.checks.at(-1) as unknown as { note: { text: string } }).note.text = 'changed';
    await useDevice(new IDBFactory());
    const error = (await importBackup(JSON.stringify(doc)).catch((e: unknown) => e)) as StoreError;
    expect(error.refused).toEqual([expect.objectContaining({ seq: content.seq, why: expect.stringMatching(/content does not match its hash/) })]);
  });
});
