// Shared set-up for the store tests: a fresh fake IndexedDB per test, sample vessels and checks
// (invented test data, not demo data), and a way to make a write fail as a full disk does.
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import { afterEach, beforeEach } from 'vitest';
import type { CheckResult, Reading, StoredCheckResult, VesselSpec } from '../../src/core/index.ts';
import { closeStore, openStore, type NewCheck, type OpenStoreOptions, type StoreEvent } from '../../src/store/index.ts';
import { resetPersistenceMemo } from '../../src/store/settings.ts';

export const events: StoreEvent[] = [];

/** A fresh, empty IndexedDB for each test, and the store closed after it. */
export function useFreshDatabase(options: OpenStoreOptions = {}): void {
  beforeEach(async () => {
    (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
    events.length = 0;
    resetPersistenceMemo();
    await openStore({ onEvent: (e) => events.push(e), ...options });
  });
  afterEach(async () => {
    await closeStore();
  });
}

/**
 * The store keeps a spec, a reading and a result as they come (it checks only that they are plain
 * JSON), so its tests use small invented stand-ins rather than the engine's full shapes; these
 * give them the record types' names.
 */
export const loose = {
  spec: (x: object) => x as VesselSpec,
  reading: (x: object) => x as Reading,
  result: (x: object) => x as CheckResult,
  stored: (x: object) => x as StoredCheckResult,
};

/** A vessel spec of the loose JSON kind the store keeps (test data). */
export const SPEC = loose.spec({ volumeM3: 2.5, tareKg: 1200, mawpPa: 1.0e6, reliefSetPa: 0.95e6 });

/** A check for `vesselId`; fields may be overridden. */
export function sampleCheck(vesselId: string, overrides: Partial<NewCheck> = {}): NewCheck {
  return {
    vesselId,
    technician: 'R. Okafor',
    note: 'routine',
    takenAt: new Date('2026-12-01T21:05:00Z'),
    inputs: {
      temperature: { text: '151,8', unit: 'degC' },
      pressure: { text: '4,0', unit: 'bar', reference: 'gauge' },
      grossWeight: { text: '2450', unit: 'kg' },
    },
    reading: loose.reading({ temperatureK: 424.95, pressurePa: 501325, grossMassKg: 2450 }),
    result: loose.result({ verdict: 'consistent', quality: 0.0123, liquidMassKg: 1243.2 }),
    cautions: [{ signal: 'CAUTION', message: 'Test caution text.', rule: 'test-rule' }],
    appVersion: '0.1.0',
    formulationId: 'IAPWS-IF97 (R7-97(2012))',
    ...overrides,
  };
}

/**
 * Makes the store's next write of a record for which `match` is true end the way Chromium ends a
 * write over quota: the request itself succeeds, then the transaction aborts with a
 * QuotaExceededError (so only tx.done reports it). Uses fake-indexeddb's internal _abort, the one
 * way to give an abort that error name. Returns a function that undoes the patch.
 */
export function failWritesOverQuota(match: (value: unknown) => boolean): () => void {
  const proto = globalThis.IDBObjectStore.prototype as unknown as Record<'add' | 'put', (this: IDBObjectStore, v: unknown, k?: IDBValidKey) => IDBRequest>;
  const originals = { add: proto.add, put: proto.put };
  for (const method of ['add', 'put'] as const) {
    proto[method] = function (this: IDBObjectStore, value: unknown, key?: IDBValidKey) {
      const request = originals[method].call(this, value, key);
      if (match(value)) {
        const tx = this.transaction as unknown as { _abort(name: string): void };
        request.addEventListener('success', () => tx._abort('QuotaExceededError'));
      }
      return request;
    };
  }
  return () => {
    proto.add = originals.add;
    proto.put = originals.put;
  };
}
