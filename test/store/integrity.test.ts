import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  canonicalJson,
  computeCheckHash,
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
      vessel: { tag: 'CR-3', spec: { volumeM3: 1.8 } },
      inputs: { temperature: { text: '150', unit: 'degC' } },
      reading: { temperatureK: 423.15 },
      result: { verdict: 'consistent' },
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
