// The documents Tankside keeps on the plant server (deploy/README.md has the whole layout), and
// the checks a receiving device makes on each envelope before the store checks the record itself.
//
// tankside-checks: one document per record of a device's chain,
//   _id "<deviceId>:<seq, 10 digits>", { type, deviceId, seq, id, hash, text }, text the record's
//   canonical JSON exactly as stored and hashed (never re-serialised). `type` is the record's kind:
//   "check", or the `kind` member of a record of another kind ("cycle", "periodic-test"; they pass
//   the same rules). Seq 0, "<deviceId>:0000000000", is the device's public key record (type
//   "device-key"), written once. A record saved signed carries its chain-head signature
//   (signing.ts) beside the text, in `signature`: the signature covers (deviceId, seq, hash), so it
//   needs no place in the text, and records saved before their device signed (or by an older
//   version of the app) have none.
// tankside-plant: one document per version of a vessel definition and author,
//   _id "vessel:<vesselId>:<version, 6 digits>:<author>", { type: "vessel", vesselId, version, author, text };
//   and the instrument register: one document per instrument edit and author,
//   _id "instrument:<id>:<revision, 15 digits>:<author>" (revision: the edit's time, ms), and one per
//   calibration or fitting, _id "calibration:<id>" / "fitting:<id>" (append-only: written once),
//   each { type, recordId, revision, author, text }, text the record's canonical JSON.
import type { OwnRecord, VesselVersion } from '../store/transfer.ts';
import type { RegisterDocType, RegisterItem } from '../store/register-sync.ts';

export const CHECKS_DB = 'tankside-checks';
export const PLANT_DB = 'tankside-plant';

/** A record of a device's chain as the server holds it. */
export interface RecordDoc {
  _id: string;
  _rev?: string;
  type: string;
  deviceId: string;
  seq: number;
  id?: string;
  hash?: string;
  text: string;
  /** The record's chain-head signature, 86 base64url characters (64 bytes, r ‖ s); absent for none. */
  signature?: string;
}

/** A signature as the server's rules accept it: 64 bytes in base64url without padding. */
const SIGNATURE_PATTERN = /^[A-Za-z0-9_-]{86}$/;

/** A vessel version as the server holds it. */
export interface VesselDoc {
  _id: string;
  _rev?: string;
  type: 'vessel';
  vesselId: string;
  version: number;
  author: string;
  text: string;
}

/** A register record as the server holds it. */
export interface RegisterDoc {
  _id: string;
  _rev?: string;
  type: RegisterDocType;
  recordId: string;
  /** An instrument's edit time, ms; 0 for calibrations and fittings. */
  revision: number;
  author: string;
  text: string;
}

export const REGISTER_DOC_TYPES: readonly RegisterDocType[] = ['instrument', 'calibration', 'fitting'];

export function registerDocId(type: RegisterDocType, recordId: string, revision: number, author: string): string {
  return type === 'instrument' ? `instrument:${recordId}:${String(revision).padStart(15, '0')}:${author}` : `${type}:${recordId}`;
}

/** The document for one register record published from this device. */
export function registerDoc(item: RegisterItem, author: string): RegisterDoc {
  return { _id: registerDocId(item.type, item.recordId, item.revision, author), type: item.type, recordId: item.recordId, revision: item.revision, author, text: item.text };
}

/** As envelopeProblem, for a register record: its id made of its members, its text's id and (an instrument) edit time equal to them. */
export function registerEnvelopeProblem(doc: RegisterDoc): string | null {
  if (typeof doc.text !== 'string') return 'no text';
  const id = registerDocId(doc.type, doc.recordId, doc.revision, doc.author);
  if (doc._id !== id) return `_id is not ${id}`;
  let record: Record<string, unknown>;
  try {
    record = JSON.parse(doc.text) as Record<string, unknown>;
  } catch {
    return 'text is not JSON';
  }
  if (record?.['id'] !== doc.recordId) return 'recordId differs from the text';
  if (doc.type === 'instrument' && Date.parse(String(record['updatedAt'])) !== doc.revision) return 'revision differs from the instrument\'s edit time in the text';
  return null;
}

export function recordDocId(deviceId: string, seq: number): string {
  return `${deviceId}:${String(seq).padStart(10, '0')}`;
}

export function vesselDocId(vesselId: string, version: number, author: string): string {
  return `vessel:${vesselId}:${String(version).padStart(6, '0')}:${author}`;
}

/** The document for one of this device's records. */
export function recordDoc(deviceId: string, r: OwnRecord): RecordDoc {
  const doc: RecordDoc = { _id: recordDocId(deviceId, r.seq), type: r.kind, deviceId, seq: r.seq, id: r.id, hash: r.hash, text: r.text };
  if (r.signature !== '') doc.signature = r.signature;
  return doc;
}

/** The document for this device's public key record (seq 0), written once at enrolment. */
export function deviceKeyDoc(deviceId: string, text: string): RecordDoc {
  return { _id: recordDocId(deviceId, 0), type: 'device-key', deviceId, seq: 0, text };
}

export function vesselDoc(entry: VesselVersion, text: string): VesselDoc {
  return { _id: vesselDocId(entry.vesselId, entry.version, entry.author), type: 'vessel', vesselId: entry.vesselId, version: entry.version, author: entry.author, text };
}

/**
 * Why a pulled record document cannot be taken (`problem`, null when its envelope is sound), and
 * its text as parsed here (`parsed`), which the store's merge takes instead of parsing the text
 * again. The server's rules should have refused a bad envelope, so one that gets here was written
 * past them (by an administrator, or by a server without the rules) and is reported, not stored.
 */
export function readEnvelope(doc: RecordDoc): { problem: string; parsed?: undefined } | { problem: null; parsed: Record<string, unknown> } {
  const refuse = (problem: string) => ({ problem });
  if (typeof doc.text !== 'string') return refuse('no text');
  if (typeof doc.deviceId !== 'string' || !Number.isSafeInteger(doc.seq)) return refuse('no deviceId or seq');
  if (doc._id !== recordDocId(doc.deviceId, doc.seq)) return refuse(`_id is not ${recordDocId(doc.deviceId, doc.seq)}`);
  if (doc.signature !== undefined && (typeof doc.signature !== 'string' || !SIGNATURE_PATTERN.test(doc.signature) || doc.seq === 0)) {
    return refuse('signature is not 86 base64url characters on a record of seq 1 or more');
  }
  let record: Record<string, unknown>;
  try {
    record = JSON.parse(doc.text) as Record<string, unknown>;
  } catch {
    return refuse('text is not JSON');
  }
  if (typeof record !== 'object' || record === null) return refuse('text is not a JSON object');
  if (record['deviceId'] !== doc.deviceId || record['seq'] !== doc.seq) return refuse('deviceId or seq differ from the text');
  if (doc.seq === 0) return doc.type === 'device-key' ? { problem: null, parsed: record } : refuse('seq 0 is not a device-key record');
  if (record['id'] !== doc.id || record['hash'] !== doc.hash) return refuse('id or hash differ from the text');
  const kind = record['kind'] === undefined ? 'check' : record['kind'];
  if (kind !== doc.type) return refuse(`type ${doc.type} differs from the record's kind ${String(kind)}`);
  return { problem: null, parsed: record };
}

/** As envelopeProblem, for a vessel version. */
export function vesselEnvelopeProblem(doc: VesselDoc): string | null {
  if (typeof doc.text !== 'string') return 'no text';
  if (doc._id !== vesselDocId(doc.vesselId, doc.version, doc.author)) return `_id is not ${vesselDocId(doc.vesselId, doc.version, doc.author)}`;
  let entry: Record<string, unknown>;
  try {
    entry = JSON.parse(doc.text) as Record<string, unknown>;
  } catch {
    return 'text is not JSON';
  }
  if (entry?.['vesselId'] !== doc.vesselId || entry['version'] !== doc.version || entry['author'] !== doc.author) {
    return 'vesselId, version or author differ from the text';
  }
  return null;
}
