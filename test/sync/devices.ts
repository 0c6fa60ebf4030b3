// Several devices in one test process: each gets its own copy of the store and sync modules
// (vi.resetModules before importing them) over its own fake IndexedDB, so two devices' stores
// and connections never mix, as two phones' would not.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { vi } from 'vitest';
import { generatedChecks, generatedVessels, backupText, type LogSpec } from '../../bench/generated-log.ts';

type Store = typeof import('../../src/store/index.ts');
type Transfer = typeof import('../../src/store/transfer.ts');
type Sync = typeof import('../../src/sync/index.ts');

export interface Device {
  id: string;
  store: Store;
  transfer: Transfer;
  sync: Sync;
  /** Enrols the device with the stand-in at `server`. */
  enrol(server: string, password: string, role?: 'technician' | 'supervisor'): Promise<void>;
  /** One sync with Node's fetch and a quick retry (a few seconds of patience in all unless given). */
  syncNow(options?: Partial<Parameters<Sync['syncNow']>[0]>): ReturnType<Sync['syncNow']>;
}

/** A fresh device whose install id is `id` (a lower-case UUID). */
export async function makeDevice(id: string): Promise<Device> {
  vi.resetModules();
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  const store = await import('../../src/store/index.ts');
  const transfer = await import('../../src/store/transfer.ts');
  const sync = await import('../../src/sync/index.ts');
  const { getDb } = await import('../../src/store/connection.ts');
  await store.openStore({ name: `device-${id}` });
  // The install id is made by the store on first use; a test gives it the one its account is named by.
  await (await getDb()).put('settings', id, 'store:deviceId');
  return {
    id,
    store,
    transfer,
    sync,
    async enrol(server, password, role = 'technician') {
      await sync.enrol({ server, account: id, password, role });
    },
    syncNow(options = {}) {
      return sync.syncNow({ fetch: (input, init) => fetch(input, init), retry: { attempts: 4, firstDelayMs: 50, maxDelayMs: 400 }, ...options });
    },
  };
}

/** Stores `checks` generated checks (invented test data) on `device`, as its own chain, through a backup import. */
export async function seedChain(device: Device, checks: number, seed: number): Promise<void> {
  const spec: LogSpec = {
    deviceId: device.id,
    vesselPrefix: 'a11ce000',
    vessels: 20,
    checks,
    startMs: Date.UTC(2026, 10, 2, 6, 0, 0),
    stepMs: 97_000,
    technicians: ['Test Technician A', 'Test Technician B'],
    seed,
  };
  const vessels = generatedVessels(parseInt(spec.vesselPrefix, 16), spec.vessels, spec.startMs);
  const text = backupText(vessels, await generatedChecks(spec, vessels), '2026-12-01T12:00:00+01:00');
  const report = await device.transfer.importBackup(text);
  if (report.checks.added.length !== checks) throw new Error(`seeding ${device.id}: ${report.checks.rejected.length} rejected`);
}
