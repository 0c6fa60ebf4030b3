// Chain verification over the stored log, a page of blocks at a time (a large log never sits in
// memory), then each device's signatures (signatures.ts).
import { getDb } from './connection.ts';
import { readPublicKeys } from './device-keys.ts';
import { hashTextsAside } from './hash-texts.ts';
import { ChainVerifier, chainFieldsOfText, contentOfText, throwIfAborted, type ChainLink, type ChainStatus } from './integrity.ts';
import { countChecks, LOG_STORES, type LogBlock } from './log-layout.ts';
import { blocksAfter, storedHeadAt } from './log-walks.ts';
import type { CheckRecord, LongWorkOptions } from './records.ts';
import { signatureCoverage, verifyingKey, type SignatureStatus, type VerifyingKey } from './signatures.ts';

/** A device's chain as verifyStoredChains reports it: its links, and how far its signatures vouch for it. */
export type StoredChainStatus = ChainStatus & { signature: SignatureStatus };

/** Per device, the lowest and highest signed seq and the highest seq seen. */
interface Signed {
  first: number | null;
  last: number | null;
  head: number;
}

/**
 * Verifies every device's chain in the store, reading its blocks in device-then-seq order. Each
 * page of blocks is read in its own read-only transaction (a transaction cannot stay open across
 * the hashing between pages), the next one while the current one is being hashed; each hash is
 * over the stored text without its hash member, which is the record's hashed content. Then each
 * device's signatures, with the public key known for it. Reports per device: ok, or the first
 * broken record and why; and signed by which key through which seq, unsigned, or the first
 * record no valid signature vouches for. Writes nothing, so a cancel leaves nothing behind.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function verifyStoredChains(options: LongWorkOptions = {}): Promise<StoredChainStatus[]> {
  throwIfAborted(options.signal);
  const db = await getDb();
  const total = await countChecks(db.transaction(LOG_STORES));
  const verifier = new ChainVerifier();
  const readPage = (after: LogBlock | null): Promise<LogBlock[]> => {
    const page = blocksAfter(db, after);
    page.catch(() => {}); // observed below, or abandoned on cancel
    return page;
  };
  const signed = new Map<string, Signed>();
  let done = 0;
  let next = readPage(null);
  // While one page is hashed (on the hashing worker when there is one), the next is read and its
  // chain fields cut out; then the first page's results are judged, in order.
  let hashing: Prepared | null = null;
  for (;;) {
    const blocks = await next;
    throwIfAborted(options.signal);
    if (blocks.length > 0) next = readPage(blocks[blocks.length - 1]!);
    const prepared = blocks.length > 0 ? prepare(blocks, signed) : null;
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
  const chains = verifier.results();
  const stored = await readPublicKeys(db, chains.map((c) => c.deviceId));
  const out: StoredChainStatus[] = [];
  for (const chain of chains) {
    throwIfAborted(options.signal);
    const s = signed.get(chain.deviceId) ?? { first: null, last: null, head: 0 };
    const known = stored.get(chain.deviceId);
    let key: VerifyingKey | null = null;
    if (known) key = known.cryptoKey ? { key: known.cryptoKey, jwk: known.publicJwk, fingerprint: known.fingerprint } : await verifyingKey(known.publicJwk);
    const signature = await signatureCoverage({
      deviceId: chain.deviceId, key, firstSigned: s.first, lastSigned: s.last, headSeq: s.head,
      at: (seq) => storedHeadAt(db, chain.deviceId, seq),
    });
    out.push({ ...chain, signature });
  }
  return out;
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
function prepare(blocks: readonly LogBlock[], signed: Map<string, Signed>): Prepared {
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
