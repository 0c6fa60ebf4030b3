// sha256OfText against published SHA-256 example digests, Node's crypto (OpenSSL) and WebCrypto.
// Node's Buffer.from(text, 'utf8') and TextEncoder both write a lone surrogate as U+FFFD (checked
// below), so either encoding of the text is the reference for the bytes.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sha256OfText } from '../../src/store/sha256.ts';

/** SHA-256 by Node's crypto (OpenSSL) of the text as Buffer encodes it. */
function nodeSha256(text: string): string {
  return createHash('sha256').update(Buffer.from(text, 'utf8')).digest('hex');
}

function utf8Length(text: string): number {
  return Buffer.byteLength(text, 'utf8');
}

// Units chosen to reach every branch of a UTF-8 encoder: ASCII, two- and three-byte characters,
// code points above U+FFFF (a surrogate pair), and lone high and low surrogates. A lone high
// surrogate drawn just before a lone low one makes a valid pair, so both cases come up.
const anyUnit = fc.oneof(
  { arbitrary: fc.integer({ min: 0, max: 0x7f }).map((c) => String.fromCharCode(c)), weight: 6 },
  { arbitrary: fc.integer({ min: 0x80, max: 0x7ff }).map((c) => String.fromCharCode(c)), weight: 2 },
  { arbitrary: fc.integer({ min: 0x800, max: 0xffff }).map((c) => String.fromCharCode(c)), weight: 2 }, // surrogates too
  { arbitrary: fc.integer({ min: 0x10000, max: 0x10ffff }).map((c) => String.fromCodePoint(c)), weight: 2 },
  { arbitrary: fc.integer({ min: 0xd800, max: 0xdbff }).map((c) => String.fromCharCode(c)), weight: 1 },
  { arbitrary: fc.integer({ min: 0xdc00, max: 0xdfff }).map((c) => String.fromCharCode(c)), weight: 1 },
  { arbitrary: fc.constantFrom('−', '°', 'é', '€', '😀', '\ufffd', '\ufeff', '\u0000'), weight: 1 },
);

// fast-check's default size keeps strings to a few dozen units whatever maxLength says; 'max'
// spreads their lengths over the whole range.
const text300 = fc.string({ unit: anyUnit, maxLength: 300, size: 'max' });

// Long texts as a short random piece repeated, plus a random tail: many 4,096-byte buffers and
// every alignment, yet a failure shrinks in a few steps (shrinking a 10,000-unit string one unit
// at a time would take minutes, and a synchronous property cannot be timed out).
const longText = fc
  .tuple(
    fc.string({ unit: anyUnit, minLength: 1, maxLength: 40, size: 'max' }),
    fc.integer({ min: 1, max: 600 }),
    fc.string({ unit: anyUnit, maxLength: 40, size: 'max' }),
  )
  .map(([piece, times, tail]) => piece.repeat(times) + tail);

/** The lengths in bytes where SHA-256's padding (FIPS 180-4 §5.1.1) changes shape. */
const PADDING_EDGES = [55, 56, 63, 64, 119, 120];

describe('sha256OfText: published example digests', () => {
  // Expected digests as written in php-src ext/hash/tests/sha256.phpt (its "FIPS-180 Vectors": the
  // NIST SHA-256 examples "abc", the 448-bit two-block message and one million "a"; the empty
  // string is among its other cases). Each is also checked against Node's crypto.
  const vectors: [name: string, text: string, digest: string][] = [
    ['"abc"', 'abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    ['the empty string', '', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
    [
      'the 448-bit message',
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    ],
    ['one million "a"', 'a'.repeat(1_000_000), 'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0'],
  ];
  for (const [name, text, digest] of vectors) {
    it(`${name} (php-src ext/hash/tests/sha256.phpt; Node's crypto)`, () => {
      expect(sha256OfText(text)).toBe(digest);
      expect(nodeSha256(text)).toBe(digest);
    });
  }
});

describe('sha256OfText: lone surrogates', () => {
  it('the references agree: Buffer and TextEncoder write a lone surrogate as U+FFFD, EF BF BD (WHATWG Encoding; Node)', () => {
    const encoder = new TextEncoder();
    for (const text of ['\ud800', '\udfff', 'a\udc00b', '\ud83d', '\ude00\ud83d', 'x\udbff\udbff\udfffy', '\ud83d\ude00']) {
      expect(Buffer.from(text, 'utf8').equals(Buffer.from(encoder.encode(text)))).toBe(true);
    }
    expect(Buffer.from('\ud800', 'utf8').toString('hex')).toBe('efbfbd');
  });

  it('hashes a lone surrogate as U+FFFD and a pair as one code point (Node crypto over explicit bytes)', () => {
    const hex = (bytes: number[]): string => createHash('sha256').update(Buffer.from(bytes)).digest('hex');
    expect(sha256OfText('\ud800')).toBe(hex([0xef, 0xbf, 0xbd]));
    expect(sha256OfText('\udc00')).toBe(hex([0xef, 0xbf, 0xbd]));
    expect(sha256OfText('\ud800a')).toBe(hex([0xef, 0xbf, 0xbd, 0x61]));
    expect(sha256OfText('\udc00\ud800')).toBe(hex([0xef, 0xbf, 0xbd, 0xef, 0xbf, 0xbd]));
    // U+1F600 is F0 9F 98 80 in UTF-8 (RFC 3629 §3, worked by hand from the code point).
    expect(sha256OfText('\ud83d\ude00')).toBe(hex([0xf0, 0x9f, 0x98, 0x80]));
    expect(sha256OfText('\ud83d\ud83d\ude00')).toBe(hex([0xef, 0xbf, 0xbd, 0xf0, 0x9f, 0x98, 0x80]));
  });
});

describe('sha256OfText: lengths where the padding and the buffering change (Node crypto)', () => {
  // Every length up to three blocks, in ASCII and with a two-, three- or four-byte character
  // last, so the message ends on and around each padding edge with a multi-byte character
  // crossing it; and the same around 4,096 and 8,192 bytes, where the encoder hands its buffer
  // to the compression, and with the non-ASCII character at each place within four units (the
  // encoder takes ASCII four units at a time).
  it('around the padding edges 55/56, 63/64, 119/120 bytes', () => {
    for (const edge of PADDING_EDGES) {
      for (let bytes = edge - 4; bytes <= edge + 4; bytes += 1) {
        for (const tail of ['', 'é', '€', '😀', '\ud800']) {
          const text = 'q'.repeat(bytes - utf8Length(tail)) + tail;
          expect(utf8Length(text)).toBe(bytes);
          expect(sha256OfText(text), `${bytes} bytes ending ${JSON.stringify(tail)}`).toBe(nodeSha256(text));
        }
      }
    }
  });

  it('every length from 0 to 192 bytes', () => {
    for (let bytes = 0; bytes <= 192; bytes += 1) {
      const text = 'abcdefghijklmnopqrstuvwxyz0123456789'.repeat(6).slice(0, bytes);
      expect(sha256OfText(text), `${bytes} bytes`).toBe(nodeSha256(text));
    }
  });

  it('around 4,096 and 8,192 bytes, with a character crossing the edge', () => {
    for (const edge of [4096, 8192]) {
      for (let bytes = edge - 5; bytes <= edge + 5; bytes += 1) {
        for (const tail of ['', 'é', '€', '😀', '😀x', 'é€😀', '\udc00\ud800']) {
          const text = 'z'.repeat(bytes - utf8Length(tail)) + tail;
          expect(sha256OfText(text), `${bytes} bytes ending ${JSON.stringify(tail)}`).toBe(nodeSha256(text));
        }
      }
    }
  });

  it('with the non-ASCII character at each place in a group of four units', () => {
    for (let at = 0; at < 12; at += 1) {
      for (const odd of ['é', '€', '😀', '\ud800', '\udc00']) {
        const text = 'm'.repeat(at) + odd + 'n'.repeat(70);
        expect(sha256OfText(text), `${JSON.stringify(odd)} after ${at}`).toBe(nodeSha256(text));
      }
    }
  });
});

describe('sha256OfText: random strings (property, Node crypto)', () => {
  it('any code points, including above U+FFFF (fast-check unit "binary")', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 300, size: 'max' }), (text) => {
        expect(sha256OfText(text)).toBe(nodeSha256(text));
      }),
      { numRuns: 2000 },
    );
  });

  it('printable graphemes (fast-check unit "grapheme")', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 200, size: 'max' }), (text) => {
        expect(sha256OfText(text)).toBe(nodeSha256(text));
      }),
      { numRuns: 1000 },
    );
  });

  it('UTF-16 units of every kind, lone surrogates among them', () => {
    fc.assert(
      fc.property(text300, (text) => {
        expect(sha256OfText(text)).toBe(nodeSha256(text));
      }),
      { numRuns: 3000 },
    );
  });

  it('ending near a padding edge, with any few units last', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...PADDING_EDGES),
        fc.integer({ min: -6, max: 6 }),
        fc.nat({ max: 2 }),
        fc.string({ unit: anyUnit, maxLength: 3, size: 'max' }),
        (edge, offset, blocks, tail) => {
          const filler = Math.max(0, edge + offset + 64 * blocks - utf8Length(tail));
          const text = 'p'.repeat(filler) + tail;
          expect(sha256OfText(text)).toBe(nodeSha256(text));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('long texts, over several 4,096-byte buffers', () => {
    fc.assert(
      fc.property(longText, (text) => {
        expect(sha256OfText(text)).toBe(nodeSha256(text));
      }),
      { numRuns: 300 },
    );
  });

  it('long texts drawn unit by unit (not shrunk: the seed and path reproduce a failure)', () => {
    fc.assert(
      fc.property(fc.string({ unit: anyUnit, minLength: 1000, maxLength: 12_000, size: 'max' }), (text) => {
        expect(sha256OfText(text)).toBe(nodeSha256(text));
      }),
      { numRuns: 100, endOnFailure: true },
    );
  });

  it('gives the same digest when called again after other texts (no state left over)', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(text300, longText), { minLength: 1, maxLength: 5 }), (texts) => {
        const first = texts.map(sha256OfText);
        expect([...texts].reverse().map(sha256OfText).reverse()).toEqual(first);
        expect(first).toEqual(texts.map(nodeSha256));
      }),
      { numRuns: 100 },
    );
  });
});

describe('sha256OfText: random strings (property, WebCrypto)', () => {
  it('equals crypto.subtle.digest over TextEncoder bytes', async () => {
    const encoder = new TextEncoder();
    await fc.assert(
      fc.asyncProperty(fc.oneof(text300, longText), async (text) => {
        const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', encoder.encode(text)));
        expect(sha256OfText(text)).toBe(Buffer.from(digest).toString('hex'));
      }),
      { numRuns: 300 },
    );
  });
});
