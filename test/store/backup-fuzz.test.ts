// Property: whatever is done to a valid backup, importing it either changes nothing (the file was
// refused as a whole) or adds exactly the records the report lists as added, each of them valid,
// and touches nothing already here except vessels the report lists as updated.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { IDBFactory } from 'fake-indexeddb';
import { StoreError, closeStore, computeCheckHash, type CheckRecord } from '../../src/store/index.ts';
import { importBackup } from '../../src/store/transfer.ts';
import { dump, makeDeviceWithBackup, useDevice } from './backup-fixtures.ts';

let source = '';
let home = '';
let sourceEarly = '';

beforeAll(async () => {
  source = (await makeDeviceWithBackup(4, 'FZ')).backup;
  home = (await makeDeviceWithBackup(2, 'HM')).backup;
  // The target already holds the first two of the source's checks, so skips and links to stored records are exercised.
  // A backup of that device made when it had saved two checks: its head and signatures end there.
  const doc = JSON.parse(source);
  doc.checks = doc.checks.slice(0, 2);
  doc.signatures = doc.signatures.filter((s: { seq: number }) => s.seq <= 2);
  doc.chains = [{ ...doc.chains[0], count: 2, headSeq: 2, headHash: doc.checks[1].hash }];
  sourceEarly = JSON.stringify(doc);
});
afterAll(async () => {
  await closeStore();
});

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** Every node of a parsed document as [parent, key] pairs, in a fixed order. */
function nodes(root: Json): [Json[] | Record<string, Json>, string | number][] {
  const out: [Json[] | Record<string, Json>, string | number][] = [];
  const visit = (value: Json) => {
    if (Array.isArray(value)) value.forEach((item, i) => (out.push([value, i]), visit(item)));
    else if (value && typeof value === 'object') for (const k of Object.keys(value)) out.push([value, k]), visit(value[k]!);
  };
  visit(root);
  return out;
}

const keyName = fc.oneof(fc.constantFrom('__proto__', 'constructor', 'prototype', 'hash', 'seq', 'id', 'x'), fc.string({ maxLength: 6 }));

const structural = fc.record({
  at: fc.nat(),
  op: fc.constantFrom('set', 'delete', 'add-key', 'nudge-number', 'edit-string', 'duplicate', 'swap'),
  value: fc.jsonValue({ maxDepth: 2 }),
  key: keyName,
  other: fc.nat(),
});

type Structural = typeof structural extends fc.Arbitrary<infer T> ? T : never;

function applyStructural(text: string, m: Structural): string {
  const doc = JSON.parse(text) as Json;
  const all = nodes(doc);
  const [parent, key] = all[m.at % all.length]!;
  const container = parent as Record<string | number, Json>;
  const current = container[key];
  switch (m.op) {
    case 'set':
      container[key] = m.value as Json;
      break;
    case 'delete':
      if (Array.isArray(parent)) parent.splice(key as number, 1);
      else delete container[key];
      break;
    case 'add-key':
      if (current && typeof current === 'object' && !Array.isArray(current)) {
        // defineProperty so "__proto__" becomes an own key, as JSON.parse would make it.
        Object.defineProperty(current, m.key, { value: m.value, enumerable: true, writable: true, configurable: true });
      }
      break;
    case 'nudge-number':
      if (typeof current === 'number') container[key] = m.other % 2 ? current + 1 : -current;
      break;
    case 'edit-string':
      if (typeof current === 'string') container[key] = current.length ? current.slice(1) + current[0] : 'x';
      break;
    case 'duplicate':
      if (Array.isArray(parent)) parent.splice(key as number, 0, structuredClone(current!));
      break;
    case 'swap':
      if (Array.isArray(parent) && parent.length > 1) {
        const j = m.other % parent.length;
        [parent[key as number], parent[j]] = [parent[j]!, parent[key as number]!];
      }
      break;
  }
  return JSON.stringify(doc);
}

const textual = fc.record({
  at: fc.nat(),
  op: fc.constantFrom('replace', 'delete', 'insert'),
  length: fc.integer({ min: 1, max: 40 }),
  insert: fc.oneof(
    fc.constantFrom('"__proto__":{},', '"constructor":1,', ',', '{', '}', '[', ']', '"', '0', '-', 'e9', 'null', '\\u0000'),
    fc.string({ maxLength: 8 }),
  ),
});

function applyTextual(text: string, m: { at: number; op: string; length: number; insert: string }): string {
  const p = m.at % text.length;
  if (m.op === 'replace') return text.slice(0, p) + (m.insert[0] ?? 'x') + text.slice(p + 1);
  if (m.op === 'delete') return text.slice(0, p) + text.slice(p + m.length);
  return text.slice(0, p) + m.insert + text.slice(p);
}

const mutation = fc.oneof(
  { weight: 3, arbitrary: fc.array(structural, { minLength: 1, maxLength: 3 }).map((ms) => ({ kind: 'structural' as const, ms })) },
  { weight: 1, arbitrary: textual.map((m) => ({ kind: 'textual' as const, m })) },
);

describe('importing a mutated backup (property)', () => {
  it('changes nothing, or adds exactly the valid records it reports', async () => {
    let refused = 0;
    let merged = 0;
    await fc.assert(
      fc.asyncProperty(mutation, async (mut) => {
        const text = mut.kind === 'textual' ? applyTextual(source, mut.m) : mut.ms.reduce(applyStructural, source);
        await useDevice(new IDBFactory());
        await importBackup(home);
        await importBackup(sourceEarly);
        const before = await dump();

        let report;
        try {
          report = await importBackup(text);
        } catch (error) {
          expect(error).toBeInstanceOf(StoreError);
          expect((error as StoreError).code).toBe('invalid-backup');
          expect(await dump()).toEqual(before);
          refused += 1;
          return;
        }
        merged += 1;
        const after = await dump();
        const file = JSON.parse(text) as { checks: CheckRecord[] };
        const fileById = new Map(file.checks.map((c) => [c.id, c]));

        // Checks: everything here before is still here, unchanged; new ones are exactly report.added.
        const afterById = new Map(after.checks.map((c) => [c.id, c]));
        for (const c of before.checks) expect(afterById.get(c.id)).toEqual(c);
        const beforeIds = new Set(before.checks.map((c) => c.id));
        const newIds = after.checks.filter((c) => !beforeIds.has(c.id)).map((c) => c.id).sort();
        expect(newIds).toEqual([...report.checks.added].sort());
        for (const id of newIds) {
          const saved = afterById.get(id)!;
          expect(saved).toEqual(fileById.get(id));
          expect(await computeCheckHash(saved)).toBe(saved.hash);
        }
        expect(report.checks.added.length + report.checks.skipped.length).toBe(file.checks.length);

        // Vessels: unchanged unless reported updated; new ones exactly report.added.
        const afterVessels = new Map(after.vessels.map((v) => [v.id, v]));
        for (const v of before.vessels) {
          if (!report.vessels.updated.includes(v.id)) expect(afterVessels.get(v.id)).toEqual(v);
        }
        const beforeVesselIds = new Set(before.vessels.map((v) => v.id));
        expect(after.vessels.filter((v) => !beforeVesselIds.has(v.id)).map((v) => v.id).sort()).toEqual(
          [...report.vessels.added].sort(),
        );
      }),
      { numRuns: 150 },
    );
    // The generator must reach both outcomes, or the property says little.
    expect(refused).toBeGreaterThan(10);
    expect(merged).toBeGreaterThan(10);
  });
});
