// SHA-256 of record-sized text: µs per call for the synchronous sha256OfText and @noble/hashes next to WebCrypto's
// digest as the store issues it (digestMany: TextEncoder, crypto.subtle.digest, 256 in flight,
// hex) and Node's createHash (string in, hex out). Medians of repeated timed runs over 256 varied
// texts of 1,100 UTF-16 units, all ASCII or with a few non-ASCII characters. Prints a table and
// the load average (a shared 2-core machine); asserts only that the three agree, nothing about
// time (target for sha256OfText: about 3–5 µs per 1,100-character text in Node 20).
// Run: npx vitest run --config bench/vitest.config.ts bench/sha256.bench-run.ts
import { createHash } from 'node:crypto';
import { loadavg } from 'node:os';
import { expect, it } from 'vitest';
import { sha256OfText } from '../src/store/sha256.ts';
import { digestMany } from '../src/store/integrity.ts';
import { LENGTH, nobleSha256Hex, recordText } from './sha256-candidates.ts';

const N = 256;
const RUNS = 25;
const ASYNC_RUNS = 15;

function median(xs: number[]): number {
  const s = [...xs].sort((x, y) => x - y);
  return s[s.length >> 1] as number;
}

/** Median and fastest µs per call over RUNS timed runs of `call` over every text, ~8 ms a run. */
function timeSync(texts: readonly string[], call: (text: string) => string): { median: number; fastest: number; sink: number } {
  let sink = 0;
  // Warm-up long enough for the optimizing compiler to have finished (it compiles on another
  // thread, and the unrolled compression is a large function).
  for (const end = Date.now() + 300; Date.now() < end; ) for (const t of texts) sink += call(t).length;
  const w0 = process.hrtime.bigint();
  for (const t of texts) sink += call(t).length;
  const passNs = Number(process.hrtime.bigint() - w0);
  const reps = Math.max(1, Math.round(8e6 / passNs));
  const perCall: number[] = [];
  for (let r = 0; r < RUNS; r++) {
    const t0 = process.hrtime.bigint();
    for (let k = 0; k < reps; k++) for (const t of texts) sink += call(t).length;
    perCall.push(Number(process.hrtime.bigint() - t0) / 1e3 / (reps * texts.length));
  }
  return { median: median(perCall), fastest: Math.min(...perCall), sink };
}

/** The same for WebCrypto through the store's digestMany, 8 passes over the texts a run. */
async function timeStoreDigests(texts: readonly string[]): Promise<{ median: number; fastest: number }> {
  const count = 8 * texts.length;
  for (const end = Date.now() + 300; Date.now() < end; ) await digestMany(count, (i) => texts[i % texts.length] as string);
  const perCall: number[] = [];
  for (let r = 0; r < ASYNC_RUNS; r++) {
    const t0 = process.hrtime.bigint();
    await digestMany(count, (i) => texts[i % texts.length] as string);
    perCall.push(Number(process.hrtime.bigint() - t0) / 1e3 / count);
  }
  return { median: median(perCall), fastest: Math.min(...perCall) };
}

it('prints µs per call for SHA-256 of 1,100-character texts (the three agree)', async () => {
  const load = loadavg().map((x) => x.toFixed(2)).join(', ');
  const cases = [
    { name: 'ASCII', texts: Array.from({ length: N }, (_, i) => recordText(i, false)) },
    { name: 'with −, °, é', texts: Array.from({ length: N }, (_, i) => recordText(i, true)) },
  ];
  const lines: string[] = [];
  for (const { name, texts } of cases) {
    const bytes = Buffer.byteLength(texts[0] as string, 'utf8');
    const ours = timeSync(texts, sha256OfText);
    const noble = timeSync(texts, nobleSha256Hex);
    const node = timeSync(texts, (t) => createHash('sha256').update(t).digest('hex'));
    const web = await timeStoreDigests(texts);
    const row = (label: string, m: { median: number; fastest: number }): string =>
      `  ${label.padEnd(48)} ${m.median.toFixed(2).padStart(7)} µs   (fastest run ${m.fastest.toFixed(2)} µs)`;
    lines.push(
      `${name}, ${LENGTH} units, ${bytes} bytes of UTF-8:`,
      row('sha256OfText', ours),
      row('@noble/hashes sha256 (TextEncoder, bytesToHex)', noble),
      `  ${'noble ÷ ours'.padEnd(48)} ${(noble.median / ours.median).toFixed(2).padStart(7)}×`,
      row('WebCrypto digest, 256 in flight (digestMany)', web),
      row("Node createHash('sha256')", node),
    );
    const expected = texts.map((t) => createHash('sha256').update(t).digest('hex'));
    expect(texts.map(sha256OfText)).toEqual(expected);
    expect(texts.map(nobleSha256Hex)).toEqual(expected);
    expect(await digestMany(texts.length, (i) => texts[i] as string)).toEqual(expected);
    expect(ours.sink + noble.sink + node.sink).toBeGreaterThan(0);
  }
  const loadAfter = loadavg().map((x) => x.toFixed(2)).join(', ');
  console.log(
    `\nSHA-256, µs per call: median of ${RUNS} runs (WebCrypto ${ASYNC_RUNS}) over ${N} texts; Node ${process.versions.node}\n` +
      `load average before ${load}, after ${loadAfter} (2 cores, shared)\n${lines.join('\n')}\n`,
  );
});
