// Two "devices" (separate fake IndexedDB factories) with invented test records, and helpers to
// switch the store between them and to dump a database for before/after comparisons.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { addVessel, appendCheck, closeStore, openStore, retireVessel, type CheckRecord, type VesselRecord } from '../../src/store/index.ts';
import { exportBackup } from '../../src/store/transfer.ts';
import { getDb } from '../../src/store/connection.ts';
import { resetPersistenceMemo } from '../../src/store/settings.ts';
import { SPEC, sampleCheck, loose } from './fixtures.ts';
import { storedChecks } from './log-access.ts';

/** Points the store at `factory` (closing the previous connection). */
export async function useDevice(factory: IDBFactory): Promise<void> {
  await closeStore();
  (globalThis as { indexedDB: IDBFactory }).indexedDB = factory;
  resetPersistenceMemo();
  await openStore();
}

/** Everything in the store: vessels and checks, each by id. */
export async function dump(): Promise<{ vessels: VesselRecord[]; checks: CheckRecord[] }> {
  const db = await getDb();
  const checks = (await storedChecks()).sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  return { vessels: await db.getAll('vessels'), checks };
}

/** Fills the current device with `n` checks over two vessels (one retired) and one correction. */
export async function seedDevice(n: number, tagPrefix = 'FT'): Promise<void> {
  const a = await addVessel({ tag: `${tagPrefix}-1`, description: 'flash tank', spec: SPEC });
  const b = await addVessel({ tag: `${tagPrefix}-2`, spec: loose.spec({ ...SPEC, volumeM3: 4 }) });
  const t0 = Date.parse('2026-11-30T06:00:00Z');
  let first: CheckRecord | null = null;
  for (let i = 0; i < n; i += 1) {
    const c = await appendCheck(
      sampleCheck(i % 3 ? a.id : b.id, {
        takenAt: new Date(t0 + i * 3_600_000),
        note: i === 1 ? '=HYPERLINK("x") left by a test' : `shift ${i}`,
        reading: loose.reading({ temperatureK: 420 + i / 10, pressurePa: 450000 + i * 1000, grossMassKg: 2400 + i }),
      }),
    );
    first ??= c;
  }
  if (first) await appendCheck(sampleCheck(first.vesselId, { corrects: first.id, reason: 'gauge read as absolute' }));
  await retireVessel(b.id);
}

/** A device with seeded data and its export. */
export async function makeDeviceWithBackup(n: number, tagPrefix = 'FT'): Promise<{ factory: IDBFactory; backup: string }> {
  const factory = new IDBFactory();
  await useDevice(factory);
  await seedDevice(n, tagPrefix);
  return { factory, backup: await exportBackup() };
}
