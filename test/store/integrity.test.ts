import { loose } from './fixtures.ts';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  canonicalJson,
  ChainVerifier,
  computeCheckHash,
  computeCheckHashes,
  hashedContent,
  HASH_IN_FLIGHT,
  sha256Hex,
  verifyChains,
} from '../../src/store/integrity.ts';
import { GENESIS_HASH, type CheckRecord } from '../../src/store/records.ts';

describe('sha256Hex', () => {
  it('matches the FIPS 180-2 example digests (checked here with Debian python3 hashlib)', async () => {
    expect(await sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(await sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
});

describe('canonicalJson', () => {
  it('sorts keys, drops whitespace and undefined-valued keys, keeps array order', () => {
    expect(canonicalJson({ b: 1, a: [3, { d: null, c: 'x' }], e: undefined })).toBe('{"a":[3,{"c":"x","d":null}],"b":1}');
    expect(canonicalJson({ 'é': 1, Z: 2, a: 3 })).toBe('{"Z":2,"a":3,"é":1}');
    expect(canonicalJson('line\nbreak "q"')).toBe('"line\\nbreak \\"q\\""');
  });

  it('writes numbers as ECMAScript Number#toString; −0 as 0 (RFC 8785 §3.2.2.3 examples, from memory)', () => {
    expect(canonicalJson([1e30, 4.5, 0.002, 1e-27, 333333333.3333333, -0, 1e21, 1e-7])).toBe(
      '[1e+30,4.5,0.002,1e-27,333333333.3333333,0,1e+21,1e-7]',
    );
  });

  it('refuses values JSON cannot carry', () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, 10n, () => 1, Symbol('s')]) {
      expect(() => canonicalJson({ x: bad })).toThrow(/x/);
    }
    expect(() => canonicalJson([1, undefined])).toThrow(/\[1\]/);
  });

  it('is unchanged by a JSON round trip and by key order (property)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        const text = canonicalJson(value);
        expect(canonicalJson(JSON.parse(text))).toBe(text);
        expect(canonicalJson(JSON.parse(JSON.stringify(value)))).toBe(text);
      }),
    );
  });
});

/**
 * The canonical form exactly as BACKUP-FORMAT.md states it, written as plainly as possible: the
 * yardstick for the store's faster writer.
 */
function documentedCanonical(value: unknown): string {
  if (value === null) return 'null';
  if (typeof value === 'number') return Object.is(value, -0) ? '0' : String(value);
  if (typeof value === 'string' || typeof value === 'boolean') return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map(documentedCanonical).join(',')}]`;
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record).sort().filter((k) => record[k] !== undefined);
  return `{${keys.map((k) => `${JSON.stringify(k)}:${documentedCanonical(record[k])}`).join(',')}}`;
}

/** Builds an object from entries with defineProperty, so "__proto__" and "10" become own keys as given. */
function objectOf(entries: [string, unknown][], nullPrototype: boolean): Record<string, unknown> {
  const out: Record<string, unknown> = nullPrototype ? Object.create(null) : {};
  for (const [k, v] of entries) Object.defineProperty(out, k, { value: v, enumerable: true, writable: true, configurable: true });
  return out;
}

const awkwardKey = fc.oneof(
  fc.constantFrom('__proto__', 'constructor', '10', '9', '0', '01', '4294967295', 'a', 'B', 'é', '\ud800', 'hash', ''),
  fc.string({ maxLength: 4 }),
);
const awkwardValue = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small' },
    fc.constant(null),
    fc.boolean(),
    fc.double({ noNaN: true, noDefaultInfinity: true }), // includes −0
    fc.string({ unit: 'binary', maxLength: 6 }), // control characters and astral characters
    // fast-check's 'binary' strings never hold a lone surrogate; JSON.stringify escapes one.
    fc.constantFrom('\ud800', 'a\udc00b', '\udfff\ud800', '\ud83d'),
    fc.array(tie('value'), { maxLength: 4 }),
    fc
      .tuple(fc.array(fc.tuple(awkwardKey, fc.oneof(tie('value'), fc.constant(undefined))), { maxLength: 5 }), fc.boolean())
      .map(([entries, nullPrototype]) => objectOf(entries, nullPrototype)),
  ),
})).value;

describe('canonicalJson fast path', () => {
  it('writes exactly the documented form for keys in any order, index-like and "__proto__" keys, −0, undefined values (property)', () => {
    fc.assert(
      fc.property(awkwardValue, (value) => {
        expect(canonicalJson(value)).toBe(documentedCanonical(value));
      }),
      { numRuns: 500 },
    );
  });

  it('sorts index-like keys as text, reuses sorted subtrees inside unsorted ones, ignores an inherited toJSON', () => {
    expect(canonicalJson({ 9: 'a', 10: 'b', x: { d: 1, c: [{ f: 2, e: -0 }] } })).toBe('{"10":"b","9":"a","x":{"c":[{"e":0,"f":2}],"d":1}}');
    expect(canonicalJson(JSON.parse('{"z":{"__proto__":{"b":1,"a":2}},"a":1}'))).toBe('{"a":1,"z":{"__proto__":{"a":2,"b":1}}}');
    expect(canonicalJson({ b: new Date(0), a: [new Map([[1, 2]])] })).toBe('{"a":[{}],"b":{}}');
    const proto = Object.prototype as { toJSON?: () => string };
    proto.toJSON = () => 'hijacked';
    try {
      expect(canonicalJson({ a: { b: 1 }, c: [1] })).toBe('{"a":{"b":1},"c":[1]}');
    } finally {
      delete proto.toJSON;
    }
  });

  it('refuses what JSON cannot carry at any depth, in sorted and unsorted objects alike', () => {
    for (const bad of [Number.NaN, Number.NEGATIVE_INFINITY, 1n, () => 1, Symbol('s')]) {
      expect(() => canonicalJson({ a: { b: [1, { c: bad }] } })).toThrow(/a\.b\[1\]\.c/);
      expect(() => canonicalJson({ z: 1, a: { c: bad, b: 1 } })).toThrow(/a\.c/);
    }
    expect(() => canonicalJson({ a: [1, , 3] })).toThrow(/a\[1\]/); // eslint-disable-line no-sparse-arrays
  });

  it('hashedContent is the canonical JSON of the record without its hash', () => {
    const record = { seq: 2, hash: 'ff', a: { y: 1, x: 2 }, id: 'i' } as unknown as CheckRecord;
    expect(hashedContent(record)).toBe('{"a":{"x":2,"y":1},"id":"i","seq":2}');
    const sorted = JSON.parse('{"a":{"x":2,"y":1},"hash":"ff","id":"i","seq":2}') as CheckRecord;
    expect(hashedContent(sorted)).toBe('{"a":{"x":2,"y":1},"id":"i","seq":2}');
    expect(() => hashedContent({ ...record, seq: Number.NaN })).toThrow(/seq/);
  });
});

/** A chain of `n` records for one device, hashed the way the store does it (test data). */
async function chain(deviceId: string, n: number): Promise<CheckRecord[]> {
  const out: CheckRecord[] = [];
  let prevHash = GENESIS_HASH;
  for (let seq = 1; seq <= n; seq += 1) {
    const unsigned = {
      id: `00000000-0000-4000-8000-${String(seq).padStart(12, '0')}`,
      deviceId,
      seq,
      time: `2026-12-01T0${seq % 10}:00:00+01:00`,
      timeMs: Date.parse(`2026-12-01T0${seq % 10}:00:00+01:00`),
      technician: 'R. Okafor',
      note: `n${seq}`,
      vesselId: '6f0c8a52-3c1d-4e8a-9b2f-0d7e5a1c4b93',
      vessel: { tag: 'CR-3', spec: loose.spec({ volumeM3: 1.8 }) },
      inputs: { temperature: { text: '150', unit: 'degC' } },
      reading: loose.reading({ temperatureK: 423.15 }),
      result: loose.stored({ verdict: 'consistent' }),
      cautions: [],
      appVersion: '0.1.0',
      formulationId: 'IAPWS-IF97 (R7-97(2012))',
      corrects: null,
      reason: null,
      prevHash,
    };
    const record = { ...unsigned, hash: await computeCheckHash(unsigned) };
    out.push(record);
    prevHash = record.hash;
  }
  return out;
}

const D1 = 'aaaaaaaa-0000-4000-8000-000000000001';
const D2 = 'bbbbbbbb-0000-4000-8000-000000000002';

describe('verifyChains', () => {
  it('reports each device ok with its head', async () => {
    const a = await chain(D1, 5);
    const b = await chain(D2, 2);
    expect(await verifyChains([...b, ...a])).toEqual([
      { deviceId: D1, status: 'ok', count: 5, headSeq: 5, headHash: a[4]!.hash },
      { deviceId: D2, status: 'ok', count: 2, headSeq: 2, headHash: b[1]!.hash },
    ]);
  });

  it('points at a changed record (one field edited, hash left as it was)', async () => {
    const a = await chain(D1, 5);
    a[2] = { ...a[2]!, note: 'edited' };
    expect(await verifyChains(a)).toMatchObject([{ status: 'broken', problem: 'content-changed', at: { seq: 3, id: a[2]!.id } }]);
  });

  it('points at the next record when the edited one was re-hashed', async () => {
    const a = await chain(D1, 5);
    const edited = { ...a[2]!, note: 'edited' };
    a[2] = { ...edited, hash: await computeCheckHash(edited) };
    expect(await verifyChains(a)).toMatchObject([{ status: 'broken', problem: 'link-broken', at: { seq: 4 } }]);
  });

  it('points at a missing seq and at a reordered list', async () => {
    const a = await chain(D1, 5);
    expect(await verifyChains([a[0]!, a[1]!, a[3]!, a[4]!])).toMatchObject([
      { status: 'broken', problem: 'missing-seq', at: { seq: 4 }, detail: 'seq 3 missing before seq 4', count: 4 },
    ]);
    expect(await verifyChains([a[0]!, a[2]!, a[1]!])).toMatchObject([{ status: 'broken', problem: 'missing-seq', at: { seq: 3 } }]);
    expect(await verifyChains([a[0]!, a[1]!, a[0]!])).toMatchObject([{ status: 'broken', problem: 'reordered', at: { seq: 1 } }]);
  });

  it('detects two records whose places were swapped and seqs rewritten (re-hashed)', async () => {
    const a = await chain(D1, 4);
    const s2 = { ...a[2]!, seq: 2, prevHash: a[0]!.hash };
    const s3 = { ...a[1]!, seq: 3 };
    const swapped = [a[0]!, { ...s2, hash: await computeCheckHash(s2) }, { ...s3, hash: await computeCheckHash(s3) }, a[3]!];
    expect(await verifyChains(swapped)).toMatchObject([{ status: 'broken', problem: 'link-broken', at: { seq: 3 } }]);
  });

  it('a chain must start at seq 1 from 64 zeros', async () => {
    const a = await chain(D1, 3);
    expect(await verifyChains(a.slice(1))).toMatchObject([{ problem: 'missing-seq', at: { seq: 2 } }]);
    const first = { ...a[0]!, prevHash: 'f'.repeat(64) };
    expect(await verifyChains([{ ...first, hash: await computeCheckHash(first) }])).toMatchObject([{ problem: 'link-broken' }]);
  });

  it('reports progress and stops on cancel', async () => {
    const a = await chain(D1, 3);
    const seen: [number, number][] = [];
    await verifyChains(a, { onProgress: (d, t) => seen.push([d, t]) });
    expect(seen.at(-1)).toEqual([3, 3]);
    const controller = new AbortController();
    controller.abort();
    await expect(verifyChains(a, { signal: controller.signal })).rejects.toMatchObject({ code: 'cancelled' });
  });
});

describe('computeCheckHashes (many digests in flight)', () => {
  it('gives the same hashes, in order, as one digest at a time, at every group boundary', async () => {
    const records = await chain(D1, 2 * HASH_IN_FLIGHT + 3);
    const one = await Promise.all(records.map((r) => computeCheckHash(r)));
    for (const n of [0, 1, HASH_IN_FLIGHT / 2 - 1, HASH_IN_FLIGHT / 2, HASH_IN_FLIGHT / 2 + 1, HASH_IN_FLIGHT, 2 * HASH_IN_FLIGHT + 3]) {
      const seen: number[] = [];
      expect(await computeCheckHashes(records.slice(0, n), { onProgress: (d) => seen.push(d) })).toEqual(one.slice(0, n));
      expect(seen.at(-1) ?? 0).toBe(n);
      expect(seen).toEqual([...seen].sort((a, b) => a - b));
    }
    expect(one.every((h, i) => h === records[i]!.hash)).toBe(true);
  });

  it('a cancel between groups stops it: no more groups are issued and it rejects', async () => {
    const records = await chain(D1, 3 * HASH_IN_FLIGHT);
    const controller = new AbortController();
    const seen: number[] = [];
    const attempt = computeCheckHashes(records, {
      signal: controller.signal,
      onProgress: (d) => {
        seen.push(d);
        controller.abort();
      },
    });
    await expect(attempt).rejects.toMatchObject({ code: 'cancelled' });
    expect(seen).toEqual([HASH_IN_FLIGHT / 2]);
  });
});

describe('ChainVerifier.pushBatch', () => {
  /** Status when the records are fed in batches cut at `cuts`, and one by one. */
  async function both(records: CheckRecord[], cuts: number[]) {
    const batched = new ChainVerifier();
    let from = 0;
    for (const cut of [...cuts, records.length]) {
      await batched.pushBatch(records.slice(from, cut));
      from = cut;
    }
    const single = new ChainVerifier();
    for (const r of records) await single.push(r);
    expect(batched.results()).toEqual(single.results());
    return batched.results();
  }

  it('finds a fault on either side of a batch boundary as one-by-one verification does', async () => {
    const a = await chain(D1, 6);
    expect(await both(a, [3])).toMatchObject([{ status: 'ok', count: 6, headSeq: 6 }]);
    const changed = [...a];
    changed[3] = { ...a[3]!, note: 'edited' }; // first record of the second batch
    expect(await both(changed, [3])).toMatchObject([{ problem: 'content-changed', at: { seq: 4 } }]);
    const rehashed = [...a];
    const edited = { ...a[2]!, note: 'edited' }; // last record of the first batch, re-hashed
    rehashed[2] = { ...edited, hash: await computeCheckHash(edited) };
    expect(await both(rehashed, [3])).toMatchObject([{ problem: 'link-broken', at: { seq: 4 } }]);
    expect(await both([...a.slice(0, 3), ...a.slice(4)], [3])).toMatchObject([{ problem: 'missing-seq', at: { seq: 5 }, count: 5 }]);
    const b = await chain(D2, 2);
    expect(await both([...a.slice(0, 4), ...b, ...a.slice(4)], [1, 5, 7])).toMatchObject([
      { deviceId: D1, status: 'ok', count: 6 },
      { deviceId: D2, status: 'ok', count: 2 },
    ]);
  });

  it('judges an unsealed record without hashing it', async () => {
    const a = await chain(D1, 3);
    expect(await both([a[0]!, { ...a[1]!, hash: '' }, a[2]!], [1])).toMatchObject([{ problem: 'unsealed', at: { seq: 2 }, count: 3 }]);
  });

  it('a cancelled batch pushes nothing', async () => {
    const a = await chain(D1, 3);
    const verifier = new ChainVerifier();
    await verifier.pushBatch(a.slice(0, 1));
    const controller = new AbortController();
    controller.abort();
    await expect(verifier.pushBatch(a.slice(1), controller.signal)).rejects.toMatchObject({ code: 'cancelled' });
    expect(verifier.results()).toMatchObject([{ status: 'ok', count: 1, headSeq: 1 }]);
  });
});
