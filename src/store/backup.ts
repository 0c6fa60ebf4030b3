// The full JSON backup ("tankside-backup", format version 2; BACKUP-FORMAT.md is its reference):
// export, and all-or-nothing import-and-merge. Reading and validating the file is in
// backup-format.ts, deciding and writing the merge in backup-merge.ts.
//
// Import policy: the whole file is refused, and nothing is written, when any part of it fails:
// the schema (the error names the first bad field), or any record's hash, its links to the
// records beside it, its seq, or the signatures of a device that signs (the error lists every such
// record by device and seq). A file that passes is merged: a check already here and identical is
// skipped, every other record is added, vessels by their later edit, all in one transaction.
import { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, parseBackupInSteps, type BackupDocument, type ChainHead } from './backup-format.ts';
import { planMerge, refusal, writePlan, type DeviceSigning, type ImportReport, type MergePolicy } from './backup-merge.ts';
import { sealMigratedChecks } from './checks.ts';
import { getDb } from './connection.ts';
import { readPublicKeys, storedPublicKeys } from './device-keys.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import { hashTexts } from './hash-texts.ts';
import { canonicalJson, contentOfText, progressStep, throwIfAborted } from './integrity.ts';
import { blockPages, countChecks, LOG_STORES } from './log-layout.ts';
import type { CheckRecord, LongWorkOptions, PublicJwk } from './records.ts';
import { recordBackup } from './backup-record.ts';
import { signatureCoverage, verifyingKey, type SignedHead, type VerifyingKey } from './signatures.ts';
import { formatIsoWithOffset } from './time.ts';

export { BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_LIMITS, mayHoldForbiddenKey, parseBackup, parseBackupInSteps, validateCheck, validateKindRecord, validateVessel } from './backup-format.ts';
export type { BackupDocument, BackupLimits, ChainHead, FileSignature, OtherRecord } from './backup-format.ts';
export type { ImportReport, MergePolicy } from './backup-merge.ts';

// ---------------------------------------------------------------- export

/**
 * Exports every vessel, check and register record as a "tankside-backup" document of BACKUP_FORMAT_VERSION (JSON text),
 * read from one consistent snapshot, with each record's signature and each device's public key.
 * Deterministic: the same store content gives the same text apart from `exportedAt` (vessels by
 * id, checks and signatures by device then seq, each record as canonical JSON). Records this
 * install's last backup (lastBackupAt) once the text is made.
 * @throws StoreError('cancelled') if options.signal aborts
 */
export async function exportBackup(options: LongWorkOptions = {}): Promise<string> {
  return (await exportBackupParts(options)).join('');
}

/**
 * As exportBackup, as pieces whose concatenation is the document: a Blob or File made from them
 * skips building one string of the whole file (hundreds of megabytes for a large log).
 */
export async function exportBackupParts(options: LongWorkOptions = {}): Promise<string[]> {
  const db = await getDb();
  await sealMigratedChecks(db);
  throwIfAborted(options.signal);
  const tx = db.transaction(['vessels', 'settings', 'instruments', 'calibrations', 'fittings', ...LOG_STORES] as const);
  const vessels = await tx.objectStore('vessels').getAll();
  // Each by id (its key), as vessels are.
  const [instruments, calibrations, fittings] = await Promise.all([
    tx.objectStore('instruments').getAll(), tx.objectStore('calibrations').getAll(), tx.objectStore('fittings').getAll(),
  ]);
  // Records of other kinds (logKinds rows) go out with the checks, in their chains.
  const total = (await countChecks(tx)) + (await tx.objectStore('logKinds').count());
  // Blocks come in device-then-seq order, and hold each record's canonical JSON already: the
  // file's check lines are the stored texts, in the order read, one piece per page of blocks.
  // Only each device's last record is parsed, for its chain head.
  const checkParts: string[] = [];
  const signatureParts: string[] = [];
  const heads: Omit<ChainHead, 'publicKey'>[] = [];
  let device: { id: string; count: number; last: string } | null = null;
  const closeDevice = () => {
    if (!device) return;
    const last = JSON.parse(device.last) as CheckRecord;
    heads.push({ deviceId: device.id, count: device.count, headSeq: last.seq, headHash: last.hash });
  };
  let done = 0;
  for await (const page of blockPages(tx)) {
    throwIfAborted(options.signal);
    const texts: string[] = [];
    const signatures: string[] = [];
    for (const block of page) {
      if (block.texts.length === 0) continue;
      if (!device || device.id !== block.deviceId) {
        closeDevice();
        device = { id: block.deviceId, count: 0, last: '' };
      }
      for (const text of block.texts) texts.push(text);
      block.sigs?.forEach((signature, i) => {
        if (signature !== '') signatures.push(canonicalJson({ deviceId: block.deviceId, seq: block.seqs[i]!, signature }));
      });
      device.count += block.texts.length;
      device.last = block.texts[block.texts.length - 1]!;
    }
    if (texts.length > 0) checkParts.push(texts.join(',\n'));
    if (signatures.length > 0) signatureParts.push(signatures.join(',\n'));
    done += texts.length;
    options.onProgress?.(done, total);
  }
  closeDevice();
  const keys = await storedPublicKeys(tx, heads.map((h) => h.deviceId));
  await tx.done;
  const chains: ChainHead[] = heads.map((h) => ({ ...h, publicKey: keys.get(h.deviceId)?.publicJwk ?? null }));
  const exportedAt = formatIsoWithOffset(new Date());
  const parts = [
    `{"format":${JSON.stringify(BACKUP_FORMAT)},"formatVersion":${BACKUP_FORMAT_VERSION},"exportedAt":${JSON.stringify(exportedAt)},\n`,
    `"vessels":[${lines(vessels.map((v) => canonicalJson(v)))}],\n`,
    `"instruments":[${lines(instruments.map((r) => canonicalJson(r)))}],\n`,
    `"calibrations":[${lines(calibrations.map((r) => canonicalJson(r)))}],\n`,
    `"fittings":[${lines(fittings.map((r) => canonicalJson(r)))}],\n`,
    '"checks":[',
    ...pieces(checkParts),
    '],\n',
    '"signatures":[',
    ...pieces(signatureParts),
    '],\n',
    `"chains":[${lines(chains.map((h) => canonicalJson(h)))}]}\n`,
  ];
  // Made, not yet kept anywhere: the last backup is only as good as the file the person keeps;
  // this records that one was made, for the reminder.
  await recordBackup('export', exportedAt).catch(() => undefined);
  return parts;
}

function lines(items: string[]): string {
  return items.length === 0 ? '' : `\n${items.join(',\n')}\n`;
}

/** Pieces of lines (each piece already joined by ",\n") as one list: opening newline, separators, closing newline. */
function pieces(parts: readonly string[]): string[] {
  const out: string[] = [];
  parts.forEach((part, i) => out.push(i === 0 ? '\n' : ',\n', part));
  if (out.length > 0) out.push('\n');
  return out;
}

// ---------------------------------------------------------------- import

/**
 * How each device of the file stands with its signatures: the file's key (which must be the one
 * known here, if one is), and how far the file's own signatures vouch for its records.
 */
async function deviceSigning(doc: BackupDocument, stored: Awaited<ReturnType<typeof readPublicKeys>>, signatureOf: (d: string, seq: number) => string): Promise<Map<string, DeviceSigning>> {
  const heads = new Map<string, Map<number, SignedHead>>();
  const put = (deviceId: string, r: { id: string; seq: number; hash: string }) => {
    let m = heads.get(deviceId);
    if (!m) heads.set(deviceId, (m = new Map()));
    if (!m.has(r.seq)) m.set(r.seq, { id: r.id, seq: r.seq, hash: r.hash, signature: signatureOf(deviceId, r.seq) });
  };
  for (const c of doc.checks) put(c.deviceId, c);
  for (const o of doc.others) put(o.deviceId, o);
  const fileKeys = new Map<string, PublicJwk>();
  for (const h of doc.chains) if (h.publicKey) fileKeys.set(h.deviceId, h.publicKey);
  const out = new Map<string, DeviceSigning>();
  for (const [deviceId, bySeq] of heads) {
    const here = stored.get(deviceId);
    const jwk = fileKeys.get(deviceId);
    const fileKey: VerifyingKey | null = jwk ? await verifyingKey(jwk) : null;
    let keyConflict: string | null = null;
    if (fileKey && here && fileKey.fingerprint !== here.fingerprint) {
      keyConflict = `the file gives device ${deviceId.slice(0, 8)} the key with fingerprint ${fileKey.fingerprint}, but its records here are signed with the key ${here.fingerprint}`;
    }
    const key = fileKey ?? (here ? (here.cryptoKey ? { key: here.cryptoKey, jwk: here.publicJwk, fingerprint: here.fingerprint } : await verifyingKey(here.publicJwk)) : null);
    let firstSigned: number | null = null;
    let lastSigned: number | null = null;
    let headSeq = 0;
    for (const [seq, h] of bySeq) {
      headSeq = Math.max(headSeq, seq);
      if (h.signature === '') continue;
      if (firstSigned === null || seq < firstSigned) firstSigned = seq;
      if (lastSigned === null || seq > lastSigned) lastSigned = seq;
    }
    const status = await signatureCoverage({ deviceId, key, firstSigned, lastSigned, headSeq, at: async (seq) => bySeq.get(seq) });
    const signs = here !== undefined || firstSigned !== null;
    const learn = fileKey && !here && firstSigned !== null
      ? { deviceId, publicJwk: fileKey.jwk, fingerprint: fileKey.fingerprint, learntAt: formatIsoWithOffset(new Date()) }
      : null;
    out.set(deviceId, { status, required: signs, keyConflict, learn });
  }
  return out;
}

/** The canonical text a record of another kind is hashed as: the record without its hash member. */
function otherContent(record: Readonly<Record<string, unknown>>): string {
  const { hash: _hash, ...content } = record;
  return canonicalJson(content);
}

/**
 * Validates a backup completely, then merges it into the store in one strict transaction: all of
 * it lands or none of it does. Returns what was added and skipped, and why. Reads format versions
 * 1 and 2; a v1 file's records are unsigned. Progress counts hashing the file's checks, then writing.
 * @throws StoreError('invalid-backup') naming the first bad field, or (field 'checks', `refused`)
 *   listing every record whose hash, links, seq or signatures fail, with nothing written;
 *   ('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function importBackup(text: string, options: LongWorkOptions = {}): Promise<ImportReport> {
  const doc = await parseBackupInSteps(text, { signal: options.signal });
  return importDocument(doc, options);
}

/** Options of importDocument: those of any long job, and a last word before the write. */
export interface ImportOptions extends LongWorkOptions {
  /**
   * Called when everything is checked and the one write transaction is about to open; the write
   * waits for it, and does not happen if it throws. The import worker asks the page here, so a
   * Cancel the page heard before this point can stop it by ending the worker (nothing written).
   */
  beforeWrite?: () => Promise<void>;
  /** Asked when only the commit is left; false aborts the write (see writePlan). */
  beforeCommit?: () => Promise<boolean>;
}

/** importBackup's work after the file is parsed and validated. */
export async function importDocument(doc: BackupDocument, options: ImportOptions = {}): Promise<ImportReport> {
  throwIfAborted(options.signal);
  const db = await getDb();
  await sealMigratedChecks(db);
  const total = doc.checks.length * 2 + doc.vessels.length;
  // Each record's canonical text is what the store keeps; its content (the text without the
  // hash) is what the hash covers. Hashed before any transaction opens (a transaction would
  // commit while the hashing gives the page its turns).
  const texts = new Array<string>(doc.checks.length);
  const every = progressStep(total);
  let reported = 0;
  const hashes = await hashTexts(texts.length, (i) => contentOfText((texts[i] = canonicalJson(doc.checks[i]!))), {
    signal: options.signal,
    onProgress: (done) => {
      if (done - reported < every) return;
      reported = done;
      options.onProgress?.(done, total);
    },
  });
  const report = await mergeRecords(doc, texts, hashes, { ...options, progressBase: doc.checks.length, progressTotal: total });
  options.onProgress?.(total, total);
  return report;
}

/**
 * The merge of importBackup for a validated document whose checks' canonical texts and content
 * hashes are given (index for index): checks signatures, plans against the store's current state,
 * then writes in one strict transaction, planning again if another tab took a seq meanwhile. Also
 * the merge of records pulled from the plant server (sync-log.ts), with policy 'record-by-record'.
 * @throws StoreError('invalid-backup') (policy 'whole-file') listing every record that refuses the
 *   document; ('cancelled' | 'quota-exceeded' | 'write-failed') with nothing written
 */
export async function mergeRecords(
  doc: BackupDocument,
  texts: string[],
  hashes: string[],
  options: ImportOptions & { policy?: MergePolicy; progressBase?: number; progressTotal?: number } = {},
): Promise<ImportReport> {
  const db = await getDb();
  const base = options.progressBase ?? 0;
  const total = options.progressTotal ?? doc.checks.length + doc.vessels.length;
  const policy = options.policy ?? 'whole-file';
  const otherHashes = await hashTexts(doc.others.length, (i) => otherContent(doc.others[i]!.record), { signal: options.signal });
  const signatures = new Map<string, string>();
  for (const s of doc.signatures) signatures.set(`${s.deviceId} ${s.seq}`, s.signature);
  const signatureOf = (deviceId: string, seq: number) => signatures.get(`${deviceId} ${seq}`) ?? '';
  for (let attempt = 0; ; attempt += 1) {
    throwIfAborted(options.signal);
    const deviceIds = [...new Set([...doc.checks, ...doc.others].map((r) => r.deviceId))];
    const signing = await deviceSigning(doc, await readPublicKeys(db, deviceIds), signatureOf);
    const plan = await planMerge(db, doc, { texts, hashes, otherHashes, signing, signatureOf, policy });
    throwIfAborted(options.signal);
    if (plan.refused.length > 0) throw refusal(plan.refused);
    if (options.beforeWrite) {
      await options.beforeWrite();
      throwIfAborted(options.signal);
    }
    try {
      // Done so far: what came before, plus every record the plan does not write.
      const skipped = doc.vessels.length - plan.vesselWrites.length + doc.checks.length - plan.checkAdds.length;
      await writePlan(db, plan, options, base + skipped, total);
      return plan.report;
    } catch (error) {
      // Another tab saved a check with a seq the plan gave out: plan again from the new state.
      if ((error as { name?: unknown }).name === 'ConstraintError' && attempt < 2) continue;
      throw error instanceof StoreError ? error : storeErrorFromWrite(error, 'Importing the backup');
    }
  }
}
