#!/usr/bin/env node
// Draws Tankside's app icons (our own artwork: a capsule vessel, part full of water, with a
// level mark beside it) and writes them as PNG files with a minimal encoder on node:zlib.
// Run: node test/icons/draw-icons.mjs   (writes src/public/icons/*.png; commit the output)
import { deflateSync } from 'node:zlib';
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';

const OUT = resolve(import.meta.dirname, '../../src/public/icons');

const BACKGROUND = [0x0f, 0x3d, 0x4c];
const SHELL = [0xf4, 0xf1, 0xea];
const VAPOUR = [0x1d, 0x5a, 0x6d];
const WATER = [0x5c, 0xc3, 0xd6];
const MARK = [0xf2, 0xb1, 0x34];

/** Colour of the artwork at (x, y) in the unit square, or null outside a rounded tile. */
function sample(x, y, { scale, cornerRadius }) {
  if (cornerRadius > 0 && outsideRoundedSquare(x, y, cornerRadius)) return null;
  // Artwork is drawn around the centre, shrunk by `scale` (maskable icons keep it inside the safe circle).
  const u = 0.5 + (x - 0.5) / scale;
  const v = 0.5 + (y - 0.5) / scale;
  const halfStroke = 0.028;
  const d = capsuleDistance(u, v, 0.46, 0.34, 0.66, 0.19);
  const level = 0.56;
  if (Math.abs(d) <= halfStroke) return SHELL;
  if (d < -halfStroke) return v >= level ? (Math.abs(v - level) < 0.012 ? SHELL : WATER) : VAPOUR;
  if (u >= 0.73 && u <= 0.86 && Math.abs(v - level) <= 0.022) return MARK;
  if (u >= 0.73 && u <= 0.79 && (Math.abs(v - 0.36) <= 0.012 || Math.abs(v - 0.76) <= 0.012)) return SHELL;
  return BACKGROUND;
}

function outsideRoundedSquare(x, y, r) {
  const cx = Math.min(Math.max(x, r), 1 - r);
  const cy = Math.min(Math.max(y, r), 1 - r);
  return Math.hypot(x - cx, y - cy) > r;
}

/** Signed distance to a vertical capsule: segment (cx, y0)-(cx, y1), radius r. */
function capsuleDistance(u, v, cx, y0, y1, r) {
  const cy = Math.min(Math.max(v, y0), y1);
  return Math.hypot(u - cx, v - cy) - r;
}

/** RGBA pixels, 4×4 supersampled for smooth edges. */
function draw(size, options) {
  const px = Buffer.alloc(size * size * 4);
  const n = 4;
  for (let j = 0; j < size; j++) {
    for (let i = 0; i < size; i++) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let sj = 0; sj < n; sj++) {
        for (let si = 0; si < n; si++) {
          const c = sample((i + (si + 0.5) / n) / size, (j + (sj + 0.5) / n) / size, options);
          if (c) { r += c[0]; g += c[1]; b += c[2]; a += 1; }
        }
      }
      const o = (j * size + i) * 4;
      const k = n * n;
      px[o] = a ? Math.round(r / a) : 0;
      px[o + 1] = a ? Math.round(g / a) : 0;
      px[o + 2] = a ? Math.round(b / a) : 0;
      px[o + 3] = Math.round((255 * a) / k);
    }
  }
  return px;
}

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(buf) {
  let c = 0xffffffff;
  for (const byte of buf) c = CRC_TABLE[(c ^ byte) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/** PNG (8-bit RGBA, no filtering) per the PNG specification's chunk layout. */
function encodePng(size, rgba) {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // colour type RGBA
  const rows = Buffer.alloc(size * (size * 4 + 1));
  for (let j = 0; j < size; j++) rgba.copy(rows, j * (size * 4 + 1) + 1, j * size * 4, (j + 1) * size * 4);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(rows, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

mkdirSync(OUT, { recursive: true });
const icons = [
  { file: 'icon-192.png', size: 192, scale: 1, cornerRadius: 0.2 },
  { file: 'icon-512.png', size: 512, scale: 1, cornerRadius: 0.2 },
  // Maskable: full bleed; the artwork shrinks into the central safe circle (radius 40 % of the size).
  { file: 'icon-maskable-512.png', size: 512, scale: 0.78, cornerRadius: 0 },
  { file: 'apple-touch-icon-180.png', size: 180, scale: 0.9, cornerRadius: 0 },
];
for (const icon of icons) {
  const png = encodePng(icon.size, draw(icon.size, icon));
  writeFileSync(resolve(OUT, icon.file), png);
  console.log(`${icon.file}: ${icon.size}×${icon.size}, ${png.length} bytes`);
}
