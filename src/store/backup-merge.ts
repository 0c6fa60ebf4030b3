// Deciding what an import does (planMerge) and doing it in one transaction (writePlan). Under the
// import's policy ('whole-file') the plan refuses the whole file when any record fails: its hash,
// its links to the records beside it, its seq, or (for a device that signs) the signatures that
// should vouch for it. Records pulled from the plant server are merged 'record-by-record': a bad
// record is rejected alone, and one whose predecessor has not arrived yet is taken with a warning
// (the pull's feed does not follow seq order). Either way it adds what is new, skips what is here
// already, and takes each vessel's later edit.
import type { IDBPDatabase } from 'idb';
import type { BackupDocument, OtherRecord } from './backup-format.ts';
import { learnPublicKey } from './device-keys.ts';
import { StoreError, storeErrorFromWrite, type RefusedRecord } from './errors.ts';
import { canonicalJson, ChainVerifier, type ChainLink, type ChainStatus } from './integrity.ts';
import { addToLog, locateIds, LOG_STORES, readRecords, settle, type LogBlock, type NewLogEntry } from './log-layout.ts';
import { deviceBlocks } from './log-walks.ts';
import { GENESIS_HASH, isCheckRecord, type LogRecord, type KnownDeviceKey, type LongWorkOptions, type VesselRecord } from './records.ts';
import type { TanksideDB } from './schema.ts';
import type { SignatureStatus } from './signatures.ts';
import { parseIsoWithOffset } from './time.ts';
import { EMPTY_REGISTER, planRegister, type RegisterPlan } from './backup-register.ts';

/** What importBackup did, record by record (a refused file throws instead: see importBackup). */
export interface ImportReport {
  vessels: { added: string[]; updated: string[]; skipped: { id: string; why: string }[] };
  /** The instrument register's records (instruments, calibrations, fittings) together. */
  register: RegisterPlan['report'];
  checks: {
    added: string[];
    skipped: { id: string; why: string }[];
    /** Only under the 'record-by-record' policy (a 'whole-file' merge refuses instead): records not taken, and why. */
    rejected: RefusedRecord[];
  };
  /** Chain status of each device's records as they stand in the file. */
  fileChains: ChainStatus[];
  /** How far each device's signatures in the file vouch for its records, by device. */
  fileSignatures: { deviceId: string; signature: SignatureStatus }[];
  /** Records of the kinds this version keeps (record-kinds.ts): added, and skipped as already here. */
  records: { added: { id: string; kind: string }[]; skipped: { id: string; why: string }[] };
  /** Records of kinds this version does not keep, skipped (their links were checked), by kind. */
  skippedKinds: Record<string, number>;
  /** Things worth telling the user that refuse nothing. */
  warnings: string[];
}

/**
 * How a merge treats a bad record. 'whole-file' (an import): any refuses everything, a gap or a file
 * cut short included, and a device known to sign must have its new records vouched for.
 * 'record-by-record' (a pull from the plant server): a bad record is rejected alone, a gap is taken
 * with a warning, and signatures are checked only where the records came with them.
 */
export type MergePolicy = 'whole-file' | 'record-by-record';

/** How one device of the file stands with its signatures (importBackup works it out before the plan). */
export interface DeviceSigning {
  /** As the file's own signatures vouch for its records. */
  status: SignatureStatus;
  /** The device signs: a key for it is known here, or the file signs its records. */
  required: boolean;
  /** Why the file's key cannot be this device's (another key is known for it here); null when it can. */
  keyConflict: string | null;
  /** The file's key, to keep once the import lands, when none is known here yet. */
  learn: KnownDeviceKey | null;
}

export interface MergePlan {
  vesselWrites: VesselRecord[];
  register: RegisterPlan;
  checkAdds: NewLogEntry[];
  keys: KnownDeviceKey[];
  report: ImportReport;
  /** Records that refuse the whole file; when any, nothing is written. */
  refused: RefusedRecord[];
}

function byInstant(a: string, b: string): number {
  return (parseIsoWithOffset(a) ?? 0) - (parseIsoWithOffset(b) ?? 0);
}

/** Stored records of one device by seq, each parsed only when asked for. */
class StoredSeqs {
  private readonly texts = new Map<number, string>();
  private readonly parsed = new Map<number, LogRecord>();
  constructor(blocks: readonly LogBlock[]) {
    for (const b of blocks) b.seqs.forEach((seq, i) => this.texts.set(seq, b.texts[i]!));
  }
  get(seq: number): LogRecord | undefined {
    let r = this.parsed.get(seq);
    if (r) return r;
    const text = this.texts.get(seq);
    if (text === undefined) return undefined;
    this.parsed.set(seq, (r = JSON.parse(text) as LogRecord));
    return r;
  }
}

/** One record of the file in its device's chain: a check (its index in doc.checks) or a record of another kind. */
type FileLink = { check: number; other?: undefined } | { check?: undefined; other: OtherRecord; hash: string };

/**
 * Reads what the store holds for the file's records (one read-only transaction), then decides.
 * `texts` and `hashes` are each check's canonical text and computed hash, `otherHashes` each other
 * record's; `signing` how each device stands with its signatures; `signatureOf` a record's
 * signature in the file ('' for none).
 */
export async function planMerge(
  db: IDBPDatabase<TanksideDB>,
  doc: BackupDocument,
  input: {
    texts: string[]; hashes: string[]; otherHashes: string[]; signing: Map<string, DeviceSigning>;
    signatureOf: (deviceId: string, seq: number) => string; policy: MergePolicy;
  },
): Promise<MergePlan> {
  const { texts, hashes, signing } = input;
  const wholeFile = input.policy === 'whole-file';
  const tx = db.transaction(['vessels', 'instruments', 'calibrations', 'fittings', ...LOG_STORES] as const);
  const vesselStore = tx.objectStore('vessels');
  const fileRegister = doc.register ?? EMPTY_REGISTER;
  const devices = new Map<string, FileLink[]>();
  const add = (deviceId: string, link: FileLink) => {
    let list = devices.get(deviceId);
    if (!list) devices.set(deviceId, (list = []));
    list.push(link);
  };
  doc.checks.forEach((c, i) => add(c.deviceId, { check: i }));
  doc.others.forEach((o, i) => add(o.deviceId, { other: o, hash: input.otherHashes[i]! }));
  const seqOf = (l: FileLink) => (l.other ? l.other.seq : doc.checks[l.check]!.seq);
  const deviceIds = [...devices.keys()].sort();
  // One read snapshot with nothing but IndexedDB requests awaited inside it.
  const [existingVessels, existingById, existingRanges, hereInstruments, hereCalibrations, hereFittings] = await Promise.all([
    Promise.all(doc.vessels.map((v) => vesselStore.get(v.id))),
    (async () => {
      const places = await locateIds(tx, doc.checks.map((c) => c.id));
      const hits = doc.checks.filter((c) => places.get(c.id)?.at !== undefined);
      const found = await readRecords(tx, hits.map((c) => {
        const at = places.get(c.id)!.at!;
        return { deviceId: at[0], seq: at[1] };
      }));
      const records = new Map(hits.map((c, i) => [c.id, found[i]] as const));
      return doc.checks.map((c) => records.get(c.id));
    })(),
    Promise.all(
      deviceIds.map(async (d) => {
        let lo = Infinity;
        let hi = 0;
        for (const l of devices.get(d)!) {
          lo = Math.min(lo, seqOf(l));
          hi = Math.max(hi, seqOf(l));
        }
        // One either side: the record each one links to, and the one that links to it.
        return new StoredSeqs(await deviceBlocks(tx, d, Math.max(1, lo - 1), hi + 1));
      }),
    ),
    Promise.all(fileRegister.instruments.map((r) => tx.objectStore('instruments').get(r.id))),
    Promise.all(fileRegister.calibrations.map((r) => tx.objectStore('calibrations').get(r.id))),
    Promise.all(fileRegister.fittings.map((r) => tx.objectStore('fittings').get(r.id))),
    tx.done,
  ]);
  const register = planRegister(fileRegister, { instruments: hereInstruments, calibrations: hereCalibrations, fittings: hereFittings });

  const report: ImportReport = {
    vessels: { added: [], updated: [], skipped: [] },
    register: register.report,
    checks: { added: [], skipped: [], rejected: [] },
    records: { added: [], skipped: [] },
    fileChains: [],
    fileSignatures: deviceIds.map((d) => ({ deviceId: d, signature: signing.get(d)?.status ?? { state: 'unsigned' } })),
    skippedKinds: {},
    warnings: [],
  };
  const vesselWrites: VesselRecord[] = [];
  doc.vessels.forEach((v, i) => {
    const here = existingVessels[i];
    if (!here) {
      vesselWrites.push(v);
      report.vessels.added.push(v.id);
    } else if (canonicalJson(here) === canonicalJson(v)) {
      report.vessels.skipped.push({ id: v.id, why: 'already here, identical' });
    } else if (byInstant(v.updatedAt, here.updatedAt) > 0) {
      vesselWrites.push(v);
      report.vessels.updated.push(v.id);
    } else {
      report.vessels.skipped.push({ id: v.id, why: 'the vessel here was edited at the same time or later; kept it' });
    }
  });

  const checkAdds: NewLogEntry[] = [];
  const refused: RefusedRecord[] = [];
  const verifier = new ChainVerifier();
  deviceIds.forEach((d, deviceIndex) => {
    const order = devices.get(d)!.slice().sort((a, b) => seqOf(a) - seqOf(b) || (a.check ?? -1) - (b.check ?? -1));
    const here = existingRanges[deviceIndex]!;
    const sign = signing.get(d);
    const fileBySeq = new Map<number, ChainLink>();
    for (const l of order) {
      const link: ChainLink = l.other ?? doc.checks[l.check]!;
      if (!fileBySeq.has(link.seq)) fileBySeq.set(link.seq, link);
    }
    const taken = new Set<number>();
    // A file naming another key than the one known here misstates the device, whatever its records.
    if (sign?.keyConflict) refused.push({ deviceId: d, seq: seqOf(order[0]!), id: '', why: sign.keyConflict });
    for (const l of order) {
      const r: ChainLink = l.other ?? doc.checks[l.check]!;
      const computed = l.other ? l.hash : hashes[l.check]!;
      verifier.pushHashed(r, computed);
      const refuse = (why: string) => refused.push({ deviceId: d, seq: r.seq, id: r.id, why });
      // The hash first: a record changed after it was saved says so, whether or not its id is here.
      if (computed !== r.hash) {
        refuse(`seq ${r.seq}: content does not match its hash (changed after it was saved)`);
        continue;
      }
      const same = l.other ? undefined : existingById[l.check];
      if (same) {
        const file = doc.checks[l.check!]!;
        if (canonicalJson(same) === texts[l.check!]) (isCheckRecord(file) ? report.checks : report.records).skipped.push({ id: r.id, why: 'already here, identical' });
        else refuse(`seq ${r.seq}: a different ${isCheckRecord(file) ? 'check' : 'record'} with this id is already here`);
        continue;
      }
      const occupant = here.get(r.seq);
      if (occupant || taken.has(r.seq)) {
        refuse(`seq ${r.seq} of device ${d} is already taken by check ${occupant ? occupant.id : 'earlier in this file'}`);
        continue;
      }
      const prev = r.seq === 1 ? GENESIS_HASH : (here.get(r.seq - 1) ?? fileBySeq.get(r.seq - 1))?.hash;
      if (prev === undefined && wholeFile) {
        refuse(`seq ${r.seq - 1} is neither in the file nor here, so seq ${r.seq} cannot be linked to the chain`);
        continue;
      }
      if (prev === undefined) report.warnings.push(`Device ${d}: seq ${r.seq - 1} is missing, so seq ${r.seq} could not be linked.`);
      else if (prev !== r.prevHash) {
        refuse(`seq ${r.seq}: prevHash is not the hash of seq ${r.seq - 1} (a record was changed or swapped)`);
        continue;
      }
      // Filling a gap: the record after it, here already, must link to it.
      const next = here.get(r.seq + 1);
      if (next && next.prevHash !== r.hash) {
        refuse(`seq ${r.seq}: seq ${r.seq + 1} here links to another record (a record was changed or swapped)`);
        continue;
      }
      const unvouched = sign ? signatureProblem(sign, d, r.seq, wholeFile) : null;
      if (unvouched) {
        refuse(unvouched);
        continue;
      }
      taken.add(r.seq);
      if (l.other) {
        report.skippedKinds[l.other.kind] = (report.skippedKinds[l.other.kind] ?? 0) + 1;
        continue;
      }
      const record = doc.checks[l.check]!;
      checkAdds.push({ record, text: texts[l.check]!, signature: input.signatureOf(d, r.seq) });
      if (isCheckRecord(record)) report.checks.added.push(r.id);
      else report.records.added.push({ id: r.id, kind: record.kind });
    }
  });
  report.fileChains = verifier.results();
  for (const head of wholeFile ? doc.chains : []) {
    let last: ChainLink | undefined;
    for (const l of devices.get(head.deviceId) ?? []) {
      const r: ChainLink = l.other ?? doc.checks[l.check]!;
      if (!last || r.seq > last.seq) last = r;
    }
    const lastSeq = last?.seq ?? 0;
    if (lastSeq < head.headSeq) {
      // Records cut from the end of a file leave a chain that is whole as far as it goes; only the head says so.
      refused.push({
        deviceId: head.deviceId,
        seq: head.headSeq,
        id: '',
        why: `the file was exported up to seq ${head.headSeq} but holds records only up to seq ${lastSeq}`,
      });
    } else if (last && last.seq === head.headSeq && last.hash !== head.headHash) {
      refused.push({ deviceId: head.deviceId, seq: last.seq, id: last.id, why: `seq ${last.seq}: its hash is not the chain head the file names` });
    }
  }
  const kinds = Object.entries(report.skippedKinds);
  if (kinds.length > 0) {
    report.warnings.push(
      `Skipped ${kinds.map(([k, n]) => `${n.toLocaleString('en-GB')} record${n === 1 ? '' : 's'} of kind "${k}"`).join(', ')}: this version does not keep them. ` +
        'Their hashes and links were checked; their devices\' chains here show them missing until a version that keeps them imports the file.',
    );
  }
  refused.sort((a, b) => (a.deviceId < b.deviceId ? -1 : a.deviceId > b.deviceId ? 1 : a.seq - b.seq));
  const keys = [...signing.values()].flatMap((s) => (s.learn ? [s.learn] : []));
  if (!wholeFile) {
    // Record by record: what failed stays out, reported; the rest goes in.
    report.checks.rejected = refused;
    return { vesselWrites, register, checkAdds, keys, report, refused: [] };
  }
  return { vesselWrites, register, checkAdds, keys, report, refused };
}

/** Why a new record of a signing device cannot be taken, or null if a valid signature in the file vouches for it. */
function signatureProblem(sign: DeviceSigning, deviceId: string, seq: number, wholeFile: boolean): string | null {
  // A key conflict refuses the device as a whole (planMerge), not record by record.
  if (sign.keyConflict) return null;
  // Records pulled without signatures (the plant server does not carry them yet) are taken as unsigned.
  if (!sign.required || (!wholeFile && sign.status.state === 'unsigned')) return null;
  const s = sign.status;
  if (s.state === 'signed' && seq <= s.throughSeq) return null;
  if (s.state === 'failed') {
    if (seq <= s.throughSeq) return null;
    if (seq === s.at.seq) return s.detail;
    return `seq ${seq}: no valid signature of device ${deviceId.slice(0, 8)} vouches for it (they fail from seq ${s.at.seq})`;
  }
  return `seq ${seq} carries no signature that vouches for it, though device ${deviceId.slice(0, 8)} signs its records`;
}

/** The error of a file refused for its records: every one listed, by device and seq. */
export function refusal(refused: readonly RefusedRecord[]): StoreError {
  const first = refused[0]!;
  const count = refused.length === 1 ? 'one record fails' : `${refused.length.toLocaleString('en-GB')} records fail`;
  return new StoreError(
    'invalid-backup',
    `Backup file not imported, nothing changed: ${count} its checks (the first: device ${first.deviceId.slice(0, 8)} seq ${first.seq}: ${first.why}).`,
    'checks',
    { refused },
  );
}

const STRICT = { durability: 'strict' } as const;
/** A settings key nothing stores: what the reads that keep a write open while it waits for its last word ask for. */
const KEEP_OPEN_KEY = 'store:keepOpen';

/** Options of writePlan: those of any long job, and a last word before the commit. */
export interface WriteOptions extends LongWorkOptions {
  /**
   * Asked once every write is done and only the commit is left; resolving false aborts instead.
   * The import worker asks the page here, so a Cancel the page heard while the write went on is
   * still in time however late the worker heard of it (its messages trail what it has done).
   */
  beforeCommit?: (() => Promise<boolean>) | undefined;
}

/** Writes the plan in one strict transaction: all of it, or (on any failure or a cancel) none. */
export async function writePlan(db: IDBPDatabase<TanksideDB>, plan: MergePlan, options: WriteOptions, base: number, total: number): Promise<void> {
  const tx = db.transaction(['vessels', 'settings', 'instruments', 'calibrations', 'fittings', ...LOG_STORES] as const, 'readwrite', STRICT);
  let cancelled = false;
  const onAbort = () => {
    try {
      tx.abort();
      cancelled = true;
    } catch {
      // Already committed: the import finished before the cancel arrived.
    }
  };
  options.signal?.addEventListener('abort', onAbort);
  const work = async () => {
    const vessels = tx.objectStore('vessels');
    let done = base;
    const step = (n: number) => {
      done += n;
      // The last step is the commit: a full bar would say "done" while a cancel could still undo it all.
      if (!cancelled) options.onProgress?.(Math.min(done, total - 1), total);
    };
    await Promise.all([
      ...plan.vesselWrites.map((v) => vessels.put(v).then(() => step(1))),
      ...plan.register.instruments.map((r) => tx.objectStore('instruments').put(r)),
      ...plan.register.calibrations.map((r) => tx.objectStore('calibrations').put(r)),
      ...plan.register.fittings.map((r) => tx.objectStore('fittings').put(r)),
      ...plan.keys.map((k) => learnPublicKey(tx, k)),
      addToLog(tx, plan.checkAdds, step),
    ]);
    if (options.beforeCommit) {
      // The answer is not an IndexedDB request, so awaiting it would let the transaction commit on
      // its own: small reads keep it open (each one pending until the next is asked for) until
      // the answer is in, then the commit or the abort follows.
      let answer: boolean | null = null;
      void options.beforeCommit().then((go) => { answer = go; }, () => { answer = false; });
      const settings = tx.objectStore('settings');
      while (answer === null) await settings.get(KEEP_OPEN_KEY);
      if (!answer) onAbort();
    }
  };
  try {
    await settle(tx, work());
  } catch (error) {
    if (cancelled || options.signal?.aborted) throw new StoreError('cancelled', 'Import cancelled; nothing was changed.');
    if ((error as { name?: unknown }).name === 'ConstraintError') throw error;
    throw storeErrorFromWrite(error, 'Importing the backup');
  } finally {
    options.signal?.removeEventListener('abort', onAbort);
  }
}
