// One page of stored blocks made ready for chain verification, and judged once its hashes are in:
// shared by the page (verify.ts) and the verifying workers (verify-worker.ts), so both judge a
// record exactly alike. Pure: no IndexedDB here.
import { chainFieldsOfText, contentOfText, type ChainLink, type ChainVerifier } from './integrity.ts';
import type { CheckRecord } from './records.ts';

/** The blocks of a log page as verifyStoredChains reads them. */
export interface BlockTexts {
  deviceId: string;
  seqs: number[];
  texts: string[];
  sigs?: string[];
}

/** Per device, the lowest and highest signed seq and the highest seq seen. */
export interface Signed {
  first: number | null;
  last: number | null;
  head: number;
}

/** One page of blocks made ready for judging: each record's chain fields and the content its hash covers. */
export interface PreparedPage {
  links: ChainLink[];
  misplaced: (string | null)[];
  /** What each record's hash covers ('' for an unsealed record, which has none to check). */
  contents: string[];
}

/**
 * Each record's chain fields read straight from its text (no parse), and what its hash covers; a
 * text not in the store's shape is parsed instead, and judged by what it says. Notes each
 * device's signed seqs in `signed`.
 */
export function preparePage(blocks: readonly BlockTexts[], signed: Map<string, Signed>): PreparedPage {
  const contents: string[] = [];
  const links: ChainLink[] = [];
  const misplaced: (string | null)[] = [];
  for (const block of blocks) {
    let s = signed.get(block.deviceId);
    if (!s) signed.set(block.deviceId, (s = { first: null, last: null, head: 0 }));
    block.texts.forEach((text, i) => {
      const seq = block.seqs[i]!;
      if (seq > s.head) s.head = seq;
      if (block.sigs?.[i]) {
        if (s.first === null || seq < s.first) s.first = seq;
        if (s.last === null || seq > s.last) s.last = seq;
      }
      const fast = chainFieldsOfText(text, seq);
      const link: ChainLink = fast?.link ?? (JSON.parse(text) as CheckRecord);
      contents.push(link.hash === '' ? '' : fast ? fast.content : contentOfText(text));
      links.push(link);
      misplaced.push(
        link.deviceId !== block.deviceId || link.seq !== seq
          ? `seq ${link.seq}: stored as seq ${String(seq)} of device ${block.deviceId}`
          : null,
      );
    });
  }
  return { links, misplaced, contents };
}

/** Judges a prepared page, in order, with each record's computed hash (index for index). */
export function judgePage(page: PreparedPage, hashes: readonly string[], verifier: ChainVerifier): void {
  page.links.forEach((r, i) => {
    const wrong = page.misplaced[i];
    if (wrong) verifier.pushMisplaced(r, wrong);
    else verifier.pushHashed(r, r.hash === '' ? '' : hashes[i]!);
  });
}
