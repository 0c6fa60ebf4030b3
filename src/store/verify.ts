// Chain verification over the stored log, a page of blocks at a time (a large log never sits in memory).
import { getDb } from './connection.ts';
import { hashTextsAside } from './hash-texts.ts';
import { ChainVerifier, chainFieldsOfText, contentOfText, throwIfAborted, type ChainLink, type ChainStatus } from './integrity.ts';
import { countChecks, LOG_STORES, type LogBlock } from './log-layout.ts';
import { blocksAfter } from './log-walks.ts';
import type { CheckRecord, LongWorkOptions } from './records.ts';

/**
 * Verifies every device's chain in the store, reading its blocks in device-then-seq order. Each
 * page of blocks is read in its own read-only transaction (a transaction cannot stay open across
 * the hashing between pages), the next one while the current one is being hashed; each hash is
 * over the stored text without its hash member, which is the record's hashed content. Reports
 * per device: ok, or the first broken record and why. Writes nothing, so a cancel leaves nothing
 * behind.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyStoredChains(options: LongWorkOptions = {}): Promise<ChainStatus[]> {
  throwIfAborted(options.signal);
  const db = await getDb();
  const total = await countChecks(db.transaction(LOG_STORES));
  const verifier = new ChainVerifier();
  const readPage = (after: LogBlock | null): Promise<LogBlock[]> => {
    const page = blocksAfter(db, after);
    page.catch(() => {}); // observed below, or abandoned on cancel
    return page;
  };
  let done = 0;
  let next = readPage(null);
  // While one page is hashed (on the hashing worker when there is one), the next is read and its
  // chain fields cut out; then the first page's results are judged, in order.
  let hashing: Prepared | null = null;
  for (;;) {
    const blocks = await next;
    throwIfAborted(options.signal);
    if (blocks.length > 0) next = readPage(blocks[blocks.length - 1]!);
    const prepared = blocks.length > 0 ? prepare(blocks) : null;
    if (hashing) {
      const hashes = await hashing.hashes;
      throwIfAborted(options.signal);
      hashing.links.forEach((r, i) => {
        const wrong = hashing!.misplaced[i];
        if (wrong) verifier.pushMisplaced(r, wrong);
        else verifier.pushHashed(r, r.hash === '' ? '' : hashes[i]!);
      });
      done += hashing.links.length;
      options.onProgress?.(done, total);
    }
    if (!prepared) break;
    hashing = prepared;
  }
  return verifier.results();
}

/** One page of blocks made ready for judging: each record's chain fields, and its hash on the way. */
interface Prepared {
  links: ChainLink[];
  misplaced: (string | null)[];
  hashes: Promise<string[]>;
}

/**
 * Each record's chain fields read straight from its text (no parse), and the hashing of its
 * content started; a text not in the store's shape is parsed instead, and judged by what it says.
 */
function prepare(blocks: readonly LogBlock[]): Prepared {
  const contents: string[] = [];
  const links: ChainLink[] = [];
  const misplaced: (string | null)[] = [];
  for (const block of blocks) {
    block.texts.forEach((text, i) => {
      const seq = block.seqs[i]!;
      const fast = chainFieldsOfText(text, seq);
      const link: ChainLink = fast?.link ?? (JSON.parse(text) as CheckRecord);
      // An unsealed record has no hash to check; an empty text stands in for it.
      contents.push(link.hash === '' ? '' : fast ? fast.content : contentOfText(text));
      links.push(link);
      misplaced.push(
        link.deviceId !== block.deviceId || link.seq !== seq
          ? `seq ${link.seq}: stored as seq ${String(seq)} of device ${block.deviceId}`
          : null,
      );
    });
  }
  const hashes = hashTextsAside(contents);
  hashes.catch(() => {}); // observed when the page is judged, or abandoned on cancel
  return { links, misplaced, hashes };
}
