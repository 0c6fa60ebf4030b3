// What the SHA-256 benchmarks (Node: sha256.bench-run.ts, Chromium: sha256-browser.bench-run.ts)
// hash and with what: record-like texts of 1,100 UTF-16 units, and @noble/hashes' sha256 called the
// way the store would call it (one TextEncoder, hex out), to set against src/store/sha256.ts.
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';

export const LENGTH = 1100;

const UTF8 = new TextEncoder();

/** SHA-256 hex of the text's UTF-8 by @noble/hashes. */
export function nobleSha256Hex(text: string): string {
  return bytesToHex(sha256(UTF8.encode(text)));
}

/**
 * A record-like text of exactly LENGTH UTF-16 units (invented; shaped like the store's canonical
 * JSON), varied with `i` so no two calls see the same input.
 */
export function recordText(i: number, nonAscii: boolean): string {
  const note = nonAscii
    ? `Reading ${i}: gauge −0.2 bar against the transmitter, shell 41 °C, relief valve réglée and sealed.`
    : `Reading ${i}: gauge -0.2 bar against the transmitter, shell 41 degC, relief valve reset and sealed.`;
  const head = JSON.stringify({
    at: `2026-11-${String(1 + (i % 28)).padStart(2, '0')}T07:${String(i % 60).padStart(2, '0')}:00+01:00`,
    deviceId: `5f3a${(i * 2654435761 >>> 0).toString(16).padStart(8, '0')}-0000-4000-8000-000000000000`,
    gaugePa: 1.0e6 + i * 137,
    liquidLevel: (i % 100) / 100,
    note,
    seq: i + 1,
    temperatureK: 300 + (i % 50) * 1.5,
  });
  const filler = 'Walkdown ok; no leaks at flanges, drains closed, tag legible. ';
  let pad = '';
  while (head.length + pad.length + 12 < LENGTH) pad += filler;
  const text = `${head.slice(0, -1)},"remarks":"${pad}`.slice(0, LENGTH - 2) + '"}';
  if (text.length !== LENGTH) throw new Error(`text of ${text.length} units`);
  return text;
}

