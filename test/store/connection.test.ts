// The connection's life: blocked by an older tab, blocking a newer one, terminated by the browser.
import { DB_VERSION } from '../../src/store/schema.ts';
import 'fake-indexeddb/auto';
import { IDBFactory, forceCloseDatabase } from 'fake-indexeddb';
import { unwrap } from 'idb';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { addVessel, closeStore, listVessels, openStore, type StoreEvent } from '../../src/store/index.ts';
import { getDb } from '../../src/store/connection.ts';
import { DB_NAME } from '../../src/store/schema.ts';
import { SPEC } from './fixtures.ts';

let events: StoreEvent[] = [];
beforeEach(() => {
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  events = [];
});
afterEach(async () => {
  await closeStore();
});

function rawOpen(version: number, onUpgrade?: (db: IDBDatabase) => void): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = indexedDB.open(DB_NAME, version);
    request.onupgradeneeded = () => onUpgrade?.(request.result);
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error);
  });
}

describe('connection', () => {
  it('blocked: an older tab holding v1 open delays the upgrade; the store says so, then opens when it closes', async () => {
    const olderTab = await rawOpen(1, (db) => {
      db.createObjectStore('vessels', { keyPath: 'id' }).createIndex('by-tag', 'tagKey');
      db.createObjectStore('checks', { keyPath: 'id' }).createIndex('by-vessel-time', ['vesselId', 'time']);
      db.createObjectStore('settings');
    });
    // The older tab has no versionchange handler, like a build from before the handler existed.
    let opened = false;
    const opening = openStore({ onEvent: (e) => events.push(e) }).then(() => (opened = true));
    await vi.waitFor(() => expect(events).toEqual([{ type: 'blocked' }]));
    expect(opened).toBe(false);
    olderTab.close();
    await opening;
    expect(await listVessels()).toEqual([]);
  });

  it('blocking: a newer version opening elsewhere closes this connection and tells the app to reload', async () => {
    await openStore({ onEvent: (e) => events.push(e) });
    await addVessel({ tag: 'FT-1', spec: SPEC });
    const newer = await rawOpen(DB_VERSION + 1); // resolves only because the store closed its connection
    expect(newer.version).toBe(DB_VERSION + 1);
    expect(events).toEqual([{ type: 'closed-for-upgrade' }]);
    await expect(listVessels()).rejects.toMatchObject({ name: 'StoreError', code: 'closed-for-upgrade' });
    newer.close();
  });

  it('terminated: an abnormal close is reported and the next call reopens', async () => {
    await openStore({ onEvent: (e) => events.push(e) });
    const v = await addVessel({ tag: 'FT-1', spec: SPEC });
    forceCloseDatabase(unwrap(await getDb()) as never);
    // The close event waits until the connection's transactions have finished (fake-indexeddb
    // re-checks with setImmediate), which one setTimeout(0) does not reliably outlast on a busy
    // machine: wait a bounded number of turns for it, so a late event cannot land in the next test.
    for (let turn = 0; turn < 50 && events.length === 0; turn += 1) await new Promise((r) => setTimeout(r, 1));
    expect(events).toEqual([{ type: 'terminated' }]);
    expect(await listVessels()).toEqual([v]);
  });

  it('a connection closed behind the store\'s back (no close event) is reopened on the next call', async () => {
    await openStore({ onEvent: (e) => events.push(e) });
    const v = await addVessel({ tag: 'FT-1', spec: SPEC });
    (unwrap(await getDb()) as IDBDatabase).close();
    expect(await listVessels()).toEqual([v]);
    expect(events).toEqual([]);
  });

  it('unavailable: no IndexedDB gives a typed error', async () => {
    const saved = globalThis.indexedDB;
    (globalThis as { indexedDB?: unknown }).indexedDB = undefined;
    try {
      await expect(openStore()).rejects.toMatchObject({ code: 'unavailable' });
    } finally {
      (globalThis as { indexedDB: unknown }).indexedDB = saved;
    }
  });
});
