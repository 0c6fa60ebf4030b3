// The server-side rules (deploy/design/*.json, validate_doc_update, and _security) against the
// CouchDB stand-in: every write the plant-sync reference (../shared/reference/plant-sync.md,
// "Server-side rules that held") lists as refused is refused here, and the record attacked stays
// byte-identical. The statuses are the stand-in's; on Apache CouchDB 3 a re-sent document without
// _rev is a 409 conflict instead of a 403 (plant-sync.md, marked unverified there).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid } from '../../bench/generated-log.ts';
import { makeDevice, seedChain, type Device } from './devices.ts';
import { RawSession } from './session.ts';
import { StandIn } from './stand-in.ts';

const CHECKS = 'tankside-checks';
const PLANT = 'tankside-plant';
let server: StandIn;
let a: Device;
let b: Device;
let passwordA: string;
let asA: RawSession;
/** B's third record as the server holds it, and its exact JSON, to compare after every attempt. */
let bDoc: Record<string, unknown>;
let bBytes: string;
const bId = () => `${b.id}:0000000003`;

beforeAll(async () => {
  server = await StandIn.start();
  a = await makeDevice(fakeUuid(0xaa000001, 1));
  b = await makeDevice(fakeUuid(0xbb000001, 2));
  passwordA = server.addAccount('device', a.id);
  await a.enrol(server.url, passwordA);
  await b.enrol(server.url, server.addAccount('device', b.id));
  await seedChain(a, 5, 21);
  await seedChain(b, 5, 22);
  await a.syncNow();
  await b.syncNow();
  asA = new RawSession(server.url);
  expect(await asA.signIn(a.id, passwordA)).toBe(200);
  bDoc = (await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(bId())}`)).body;
  bBytes = JSON.stringify(bDoc);
}, 60_000);

afterAll(async () => {
  await server?.stop();
});

async function expectBUnchanged(): Promise<void> {
  const now = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(bId())}?conflicts=true`);
  expect(JSON.stringify(now.body)).toBe(bBytes);
}

/** A's own document for `seq`, well formed, from A's stored record. */
async function ownDoc(seq: number): Promise<Record<string, unknown>> {
  const [r] = await a.transfer.ownRecords(seq, 1);
  return { _id: `${a.id}:${String(seq).padStart(10, '0')}`, type: 'check', deviceId: a.id, seq, id: r!.id, hash: r!.hash, text: r!.text };
}

describe('writes the rules refuse (signed in as device A)', () => {
  it('overwriting B\'s record with its _rev', async () => {
    const r = await asA.request('PUT', `${CHECKS}/${encodeURIComponent(bId())}`, { ...bDoc, text: `${bDoc['text'] as string} ` });
    expect(r.status).toBe(403);
    await expectBUnchanged();
  });

  it('deleting B\'s record', async () => {
    const r = await asA.request('DELETE', `${CHECKS}/${encodeURIComponent(bId())}?rev=${bDoc['_rev'] as string}`);
    expect(r.status).toBe(403);
    await expectBUnchanged();
  });

  it('deleting it with _deleted through _bulk_docs', async () => {
    const r = await asA.request<{ error?: string }[]>('POST', `${CHECKS}/_bulk_docs`, { docs: [{ _id: bId(), _rev: bDoc['_rev'], _deleted: true }] });
    expect(r.body[0]?.error).toBe('forbidden');
    await expectBUnchanged();
  });

  it('a new record claiming B\'s device id', async () => {
    const forged: Record<string, unknown> = { ...bDoc, _id: `${b.id}:0000000006`, seq: 6 };
    delete forged['_rev'];
    const r = await asA.request('PUT', `${CHECKS}/${encodeURIComponent(forged['_id'] as string)}`, forged);
    expect(r.status).toBe(403);
    expect((await server.admin('GET', `${CHECKS}/${encodeURIComponent(forged['_id'] as string)}`)).status).toBe(404);
  });

  it('a branch of B\'s record through new_edits:false, leaving no _conflicts', async () => {
    const r = await asA.request<{ error?: string }[]>('POST', `${CHECKS}/_bulk_docs`, {
      new_edits: false,
      docs: [{ ...bDoc, _rev: '1-00000000000000000000000000000000', text: '{}' }],
    });
    expect(r.status === 201 ? r.body[0]?.error : r.status).toBe('forbidden');
    await expectBUnchanged();
  });

  it('a branch of its own record through new_edits:false', async () => {
    const own = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000002`)}`);
    const r = await asA.request<{ error?: string }[]>('POST', `${CHECKS}/_bulk_docs`, {
      new_edits: false,
      docs: [{ ...own.body, _rev: '1-11111111111111111111111111111111' }],
    });
    expect(r.body[0]?.error).toBe('forbidden');
    const after = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000002`)}?conflicts=true`);
    expect(after.body['_conflicts']).toBeUndefined();
    expect(after.body['_rev']).toBe(own.body['_rev']);
  });

  it('a new record written with new_edits:false (a revision given up front)', async () => {
    const doc = { ...(await ownDoc(1)), _id: `${a.id}:0000000009`, seq: 9, _rev: '1-22222222222222222222222222222222' };
    const r = await asA.request<{ error?: string }[]>('POST', `${CHECKS}/_bulk_docs`, { new_edits: false, docs: [doc] });
    expect(r.body[0]?.error).toBe('forbidden');
  });

  it('editing its own record', async () => {
    const own = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000002`)}`);
    const r = await asA.request('PUT', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000002`)}`, { ...own.body, hash: '0'.repeat(64) });
    expect(r.status).toBe(403);
    const after = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000002`)}`);
    expect(after.body).toEqual(own.body);
  });

  it('re-sending its own stored record without _rev (403 here; 409 on CouchDB 3)', async () => {
    const r = await asA.request('PUT', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000001`)}`, await ownDoc(1));
    expect([403, 409]).toContain(r.status);
  });

  it('an envelope that disagrees with its text (hash, id, seq, _id, kind, extra field)', async () => {
    const good: Record<string, unknown> = { ...(await ownDoc(1)), _id: `${a.id}:0000000100`, seq: 100 };
    const bad: Record<string, unknown>[] = [
      { ...good, text: (good.text as string).replace('"seq":1,', '"seq":100,'), hash: '0'.repeat(64) }, // hash differs from text
      { ...good, text: (good.text as string).replace('"seq":1,', '"seq":100,'), id: fakeUuid(1, 1) }, // id differs
      { ...good, seq: 100 }, // seq in text is 1
      { ...good, _id: `${a.id}:100` }, // _id not zero-padded
      { ...good, type: 'cycle' }, // kind of the text is check
      { ...good, note: 'smuggled' }, // a field the envelope does not have
      { ...good, text: 'not json' },
    ];
    for (const doc of bad) {
      const r = await asA.request('PUT', `${CHECKS}/${encodeURIComponent(doc['_id'] as string)}`, doc);
      expect(r.status, JSON.stringify(r.body)).toBe(403);
    }
  });

  it('writing a design document of either database', async () => {
    for (const db of [CHECKS, PLANT]) {
      const r = await asA.request('PUT', `${db}/_design/tankside`, { validate_doc_update: 'function () {}' });
      expect([401, 403]).toContain(r.status);
    }
    const ddoc = await server.admin<{ validate_doc_update: string }>('GET', `${CHECKS}/_design/tankside`);
    expect(ddoc.body.validate_doc_update).toContain('records are never replaced or deleted');
  });

  it('writing the plant database as a device', async () => {
    const vesselId = fakeUuid(0x7e55e1, 1);
    const text = JSON.stringify({ author: a.id, kind: 'vessel', vessel: { id: vesselId }, vesselId, version: 1 });
    const doc = { _id: `vessel:${vesselId}:000001:${a.id}`, type: 'vessel', vesselId, version: 1, author: a.id, text };
    const r = await asA.request<{ reason?: string }>('PUT', `${PLANT}/${encodeURIComponent(doc._id)}`, doc);
    expect(r.status).toBe(403);
    expect(r.body.reason).toBe('only supervisors write the plant database');
  });

  it('the device-key record (seq 0): once, and only its own', async () => {
    // A's first sync wrote its key record before its checks (sync/index.ts, ownDeviceKeyText).
    const stored = await server.admin<Record<string, unknown>>('GET', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000000`)}`);
    expect(stored.body).toMatchObject({ type: 'device-key', deviceId: a.id, seq: 0 });
    expect(JSON.parse(stored.body['text'] as string)).toMatchObject({ kind: 'device-key', deviceId: a.id, seq: 0, publicJwk: { kty: 'EC', crv: 'P-256' } });
    const key = (device: string) => ({ _id: `${device}:0000000000`, type: 'device-key', deviceId: device, seq: 0, text: JSON.stringify({ deviceId: device, kind: 'device-key', seq: 0 }) });
    expect((await asA.request('PUT', `${CHECKS}/${encodeURIComponent(`${a.id}:0000000000`)}`, key(a.id))).status).toBe(403);
    expect((await asA.request('PUT', `${CHECKS}/${encodeURIComponent(`${b.id}:0000000000`)}`, key(b.id))).status).toBe(403);
    await expectBUnchanged();
  });

  it('a signature that is not 64 bytes of base64url', async () => {
    const good: Record<string, unknown> = { ...(await ownDoc(1)), _id: `${a.id}:0000000200`, seq: 200 };
    good.text = (good.text as string).replace('"seq":1,', '"seq":200,');
    const bad: Record<string, unknown>[] = [
      { ...good, signature: 'not base64url!' },
      { ...good, signature: 'A'.repeat(85) },
      { ...good, signature: 12 },
    ];
    for (const doc of bad) {
      const r = await asA.request<{ reason?: string }>('PUT', `${CHECKS}/${encodeURIComponent(doc['_id'] as string)}`, doc);
      expect(r.status, JSON.stringify(r.body)).toBe(403);
      expect(r.body.reason).toBe('signature must be 86 base64url characters (64 bytes)');
    }
  });
});

describe('who may sign in and read', () => {
  it('no credentials: no reads, no writes', async () => {
    const anonymous = new RawSession(server.url);
    expect((await anonymous.request('GET', `${CHECKS}/_all_docs?limit=1`)).status).toBe(401);
    expect((await anonymous.request('PUT', `${CHECKS}/x`, { a: 1 })).status).toBe(401);
    expect((await anonymous.request('GET', `${PLANT}/_changes`)).status).toBe(401);
  });

  it('a wrong password is refused at sign-in, and the client says so in plain words', async () => {
    expect(await new RawSession(server.url).signIn(a.id, `${passwordA}x`)).toBe(401);
    const c = await makeDevice(fakeUuid(0xcc000001, 3));
    await c.enrol(server.url, 'not-the-password');
    await expect(c.syncNow()).rejects.toMatchObject({ kind: 'credentials' });
    expect((await c.transfer.getSyncState()).lastSync).toMatchObject({ outcome: 'failed' });
  });

  it('a revoked device can no longer sign in; its records stay', async () => {
    const d = await makeDevice(fakeUuid(0xdd000001, 4));
    const pw = server.addAccount('device', d.id);
    await d.enrol(server.url, pw);
    await seedChain(d, 2, 23);
    await d.syncNow();
    server.script('couch-account.mjs', ['revoke'], [d.id]);
    expect(await new RawSession(server.url).signIn(d.id, pw)).toBe(401);
    expect((await server.admin('GET', `${CHECKS}/${encodeURIComponent(`${d.id}:0000000002`)}`)).status).toBe(200);
  });

  it('the setup runs again without changing anything', () => {
    const out = server.script('couch-setup.mjs');
    expect(out).toContain('tankside-checks: already there');
    expect(out).toContain('tankside-checks/_design/tankside: already current');
    expect(out).toContain('tankside-plant/_security: already as wanted');
  });
});
