// A QR symbol as one SVG path: uqr (a small, maintained encoder from npm) gives the module grid,
// this draws each dark module as a unit square. Error correction level M (about 15 % of the symbol
// may be lost: the level uqr's documentation gives) survives a scuffed or steamed label; the quiet
// zone of four modules is the size the QR standard asks for (ISO/IEC 18004, from memory).
import { encode } from 'uqr';

export interface QrSymbol { size: number; path: string }

export function qrSymbol(text: string): QrSymbol {
  const qr = encode(text, { ecc: 'M', border: 4 });
  let path = '';
  qr.data.forEach((row, y) => {
    let x = 0;
    while (x < row.length) {
      if (!row[x]) { x += 1; continue; }
      let run = 1;
      while (row[x + run]) run += 1;
      path += `M${x} ${y}h${run}v1h-${run}z`;
      x += run;
    }
  });
  return { size: qr.size, path };
}
