// The instrument register: instruments (editable, retirable, never deleted), their calibrations
// (append-only) and fittings (append-only: which instrument sits on a vessel from when). A swap is
// a new fitting, so the old instrument keeps its history and the vessel keeps the list of what it
// carried. The store checks shape and ranges of what it keeps; the figures' meaning (a class in
// range, a calibration not after today) is the core's validateInstrument / validateCalibrations,
// which the screens run before they call here.
import { getDb } from './connection.ts';
import { StoreError, storeErrorFromWrite } from './errors.ts';
import {
  INSTRUMENT_KIND_IDS, INSTRUMENT_ROLES, INSTRUMENT_TEXT_LIMITS, KINDS_OF_ROLE, byFrom, fittedAt,
  type CalibrationEntry, type FittingRecord, type InstrumentHistory, type InstrumentRecord, type InstrumentRole, type NewCalibration, type NewInstrument,
} from './instrument-records.ts';
import type { InstrumentSpec } from '../core/instrument/index.ts';
import { formatIsoWithOffset } from './time.ts';
import { cloneJson, invalid, requireJsonObject, requireText, requireUuid } from './validate.ts';

const STRICT = { durability: 'strict' } as const;


/** The unit family of each kind: a kind may change only within it (calibration figures are in that unit). */
const FAMILY = { 'pressure-gauge': 'Pa', 'pressure-transmitter': 'Pa', barometer: 'Pa', thermometer: 'K', rtd: 'K', 'weighing-system': 'kg' } as const;

const now = () => formatIsoWithOffset(new Date(), undefined, true);
/**
 * A date kept beside its ms (calibration, due, fitting times): with its milliseconds when it has
 * any, so the text and the ms agree (the backup's validator and plant sync's pull hold them equal);
 * a whole second stays as it was written before.
 */
const exactIso = (d: Date) => formatIsoWithOffset(d, undefined, d.getTime() % 1000 !== 0);

function requireSpec(s: InstrumentSpec): InstrumentSpec {
  requireJsonObject('spec', s);
  if (!(INSTRUMENT_KIND_IDS as readonly string[]).includes(s.kind)) throw invalid('kind', `expected one of ${INSTRUMENT_KIND_IDS.join(', ')}`);
  requireText('tag', typeof s.tag === 'string' ? s.tag.trim() : s.tag, 1, INSTRUMENT_TEXT_LIMITS.tag);
  if (typeof s.range !== 'object' || !Number.isFinite(s.range?.low) || !Number.isFinite(s.range?.high) || s.range.high <= s.range.low) {
    throw invalid('range', 'expected finite low and high, high above low');
  }
  if (typeof s.tolerance !== 'object' || s.tolerance === null) throw invalid('accuracy class', 'expected a tolerance');
  return cloneJson({ ...s, tag: s.tag.trim() });
}

function requireFinite(field: string, value: unknown, span: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || Math.abs(value) > span) throw invalid(field, `expected a number from ${-span} to ${span}`);
  return value;
}

function requireDate(field: string, value: unknown): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) throw invalid(field, 'expected a valid date');
  return value;
}

async function put<S extends 'instruments' | 'calibrations' | 'fittings'>(store: S, record: S extends 'instruments' ? InstrumentRecord : S extends 'calibrations' ? CalibrationEntry : FittingRecord, what: string): Promise<void> {
  const db = await getDb();
  const tx = db.transaction(store, 'readwrite', STRICT);
  try {
    await Promise.all([tx.store.put(record as never), tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, what);
  }
}

/**
 * Adds an instrument to the register; its tag is the spec's tag (trimmed, 1–64 characters).
 * @throws StoreError('invalid-record' naming the field | 'quota-exceeded' | 'write-failed')
 */
export async function addInstrument(input: NewInstrument): Promise<InstrumentRecord> {
  const spec = requireSpec(input.spec);
  const displayUnit = requireText('display unit', input.displayUnit, 1, INSTRUMENT_TEXT_LIMITS.displayUnit);
  const description = requireText('description', input.description ?? '', 0, INSTRUMENT_TEXT_LIMITS.description);
  const at = now();
  const record: InstrumentRecord = {
    id: crypto.randomUUID(), tag: spec.tag, tagKey: spec.tag.toLowerCase(), spec, displayUnit, description,
    origin: { kind: 'entered' }, retired: false, createdAt: at, updatedAt: at,
  };
  await put('instruments', record, `Saving instrument ${spec.tag}`);
  return record;
}

/**
 * Changes an instrument's spec (tag, range, class …), display unit or description. Its kind may
 * change only within its unit (a gauge to a transmitter, a thermometer to an RTD): its calibrations'
 * figures are in that unit. Saved checks keep the limits they were taken with.
 * @throws StoreError('not-found' | 'invalid-record' | 'quota-exceeded' | 'write-failed')
 */
export async function updateInstrument(id: string, patch: { spec?: InstrumentSpec; displayUnit?: string; description?: string }): Promise<InstrumentRecord> {
  const existing = await requireInstrument(id);
  const spec = patch.spec === undefined ? existing.spec : requireSpec(patch.spec);
  if (FAMILY[spec.kind] !== FAMILY[existing.spec.kind]) {
    throw invalid('kind', `${existing.tag} measures in ${FAMILY[existing.spec.kind]}; its kind can change only to another kind measuring in it`);
  }
  const record: InstrumentRecord = {
    ...existing, spec, tag: spec.tag, tagKey: spec.tag.toLowerCase(),
    displayUnit: patch.displayUnit === undefined ? existing.displayUnit : requireText('display unit', patch.displayUnit, 1, INSTRUMENT_TEXT_LIMITS.displayUnit),
    description: patch.description === undefined ? existing.description : requireText('description', patch.description, 0, INSTRUMENT_TEXT_LIMITS.description),
    updatedAt: now(),
  };
  await put('instruments', record, `Saving instrument ${spec.tag}`);
  return record;
}

/**
 * Retires an instrument (scrapped, sent away): it stays in the register with its history, and in
 * the same transaction it is taken off every vessel place it holds now (a fitting to none, reason
 * "retired"), so no later check rests on it. Already retired: returned as it is.
 * @throws StoreError('not-found' | 'quota-exceeded' | 'write-failed')
 */
export async function retireInstrument(id: string): Promise<InstrumentRecord> {
  const existing = await requireInstrument(id);
  if (existing.retired) return existing;
  const at = new Date();
  const stamp = now();
  const record = { ...existing, retired: true, updatedAt: stamp };
  const db = await getDb();
  const tx = db.transaction(['instruments', 'fittings'], 'readwrite', STRICT);
  const fittings = tx.objectStore('fittings');
  // Awaited below; caught here too so a failed read before then leaves no unhandled rejection.
  tx.done.catch(() => undefined);
  try {
    const own = await fittings.index('by-instrument').getAll(id);
    const vessels = [...new Set(own.map((f) => f.vesselId))];
    // IndexedDB reads only between here and the writes: the transaction stays alive.
    const rows = await Promise.all(vessels.map((v) => fittings.index('by-vessel').getAll(IDBKeyRange.bound([v, -Infinity, ''], [v, Infinity, '\uffff']))));
    const writes: Promise<unknown>[] = [tx.objectStore('instruments').put(record)];
    rows.forEach((vesselRows, i) => {
      for (const [role, f] of Object.entries(fittedAt(vesselRows, at.getTime()))) {
        if (f?.instrumentId !== id) continue;
        const off: FittingRecord = {
          id: crypto.randomUUID(), vesselId: vessels[i]!, role: role as InstrumentRole, instrumentId: null,
          from: exactIso(at), fromMs: at.getTime(), reason: 'retired', enteredAt: stamp,
        };
        writes.push(fittings.put(off));
      }
    });
    await Promise.all([...writes, tx.done]);
  } catch (error) {
    throw storeErrorFromWrite(error, `Retiring instrument ${existing.tag}`);
  }
  return record;
}

/** One instrument, or undefined. */
export async function getInstrument(id: string): Promise<InstrumentRecord | undefined> {
  return (await getDb()).get('instruments', id);
}

async function requireInstrument(id: string): Promise<InstrumentRecord> {
  requireUuid('instrument id', id);
  const found = await getInstrument(id);
  if (!found) throw new StoreError('not-found', `No instrument with id ${id}.`, 'instrument id');
  return found;
}

/** Instruments sorted by tag (case-insensitive); retired ones only with `includeRetired`. */
export async function listInstruments(options: { includeRetired?: boolean } = {}): Promise<InstrumentRecord[]> {
  const all = await (await getDb()).getAllFromIndex('instruments', 'by-tag');
  return options.includeRetired ? all : all.filter((i) => !i.retired);
}

/**
 * Records a calibration (append-only). Figures in the instrument's SI unit, within ± its span;
 * the next due date after the calibration date.
 * @throws StoreError('not-found' | 'invalid-record' naming the field | 'quota-exceeded' | 'write-failed')
 */
export async function addCalibration(input: NewCalibration): Promise<CalibrationEntry> {
  const instrument = await requireInstrument(input.instrumentId);
  const span = instrument.spec.range.high - instrument.spec.range.low;
  const at = requireDate('calibration date', input.calibratedAt);
  const due = input.nextDueAt === undefined ? null : requireDate('next due date', input.nextDueAt);
  if (due !== null && due.getTime() <= at.getTime()) throw invalid('next due date', 'must be after the calibration date');
  const entry: CalibrationEntry = {
    id: crypto.randomUUID(),
    instrumentId: instrument.id,
    time: exactIso(at),
    timeMs: at.getTime(),
    asFoundError: requireFinite('as-found error', input.asFoundError, span),
    asLeftError: input.asLeftError === undefined ? null : requireFinite('as-left error', input.asLeftError, span),
    referenceValue: input.referenceValue === undefined ? null : requireFinite('reference value', input.referenceValue, Number.MAX_VALUE),
    nextDue: due === null ? null : exactIso(due),
    nextDueMs: due === null ? null : due.getTime(),
    who: requireText('calibrated by', typeof input.who === 'string' ? input.who.trim() : input.who, 1, INSTRUMENT_TEXT_LIMITS.who),
    certificate: requireText('certificate', (input.certificate ?? '').trim(), 0, INSTRUMENT_TEXT_LIMITS.certificate),
    enteredUnit: requireText('entered unit', input.enteredUnit, 1, INSTRUMENT_TEXT_LIMITS.displayUnit),
    note: requireText('note', input.note ?? '', 0, INSTRUMENT_TEXT_LIMITS.note),
    enteredAt: now(),
  };
  await put('calibrations', entry, `Saving the calibration of ${instrument.tag}`);
  return entry;
}

/** One instrument's calibrations, oldest first. */
export async function calibrationsOf(instrumentId: string): Promise<CalibrationEntry[]> {
  requireUuid('instrument id', instrumentId);
  return (await getDb()).getAllFromIndex('calibrations', 'by-instrument',
    IDBKeyRange.bound([instrumentId, -Infinity, ''], [instrumentId, Infinity, '\uffff']));
}

/** An instrument with its calibrations, or undefined. */
export async function instrumentHistory(id: string): Promise<InstrumentHistory | undefined> {
  const instrument = await getInstrument(id);
  return instrument && { instrument, calibrations: await calibrationsOf(id) };
}

/** The whole register, by tag, each instrument with its calibrations (retired ones included). One read transaction. */
export async function listRegister(): Promise<InstrumentHistory[]> {
  const db = await getDb();
  const tx = db.transaction(['instruments', 'calibrations']);
  const [instruments, calibrations] = await Promise.all([tx.objectStore('instruments').index('by-tag').getAll(), tx.objectStore('calibrations').index('by-instrument').getAll()]);
  const byInstrument = new Map<string, CalibrationEntry[]>();
  for (const c of calibrations) byInstrument.set(c.instrumentId, [...(byInstrument.get(c.instrumentId) ?? []), c]);
  return instruments.map((instrument) => ({ instrument, calibrations: byInstrument.get(instrument.id) ?? [] }));
}

/**
 * Fits an instrument to a vessel in a role from `from` (default now), or takes the role's
 * instrument off (instrumentId null). Append-only: what was fitted before stays in the history.
 * @throws StoreError('not-found' for the vessel or instrument | 'invalid-record' (a kind that cannot take the role) | 'quota-exceeded' | 'write-failed')
 */
export async function fitInstrument(vesselId: string, role: InstrumentRole, instrumentId: string | null, options: { from?: Date; reason?: string } = {}): Promise<FittingRecord> {
  requireUuid('vesselId', vesselId);
  if (!(INSTRUMENT_ROLES as readonly string[]).includes(role)) throw invalid('role', `expected one of ${INSTRUMENT_ROLES.join(', ')}`);
  const db = await getDb();
  if (!(await db.get('vessels', vesselId))) throw new StoreError('not-found', `No vessel with id ${vesselId}.`, 'vesselId');
  if (instrumentId !== null) {
    const instrument = await requireInstrument(instrumentId);
    if (!KINDS_OF_ROLE[role].includes(instrument.spec.kind)) {
      throw invalid('role', `${instrument.tag} is a ${instrument.spec.kind}; the ${role} place takes ${KINDS_OF_ROLE[role].join(' or ')}`);
    }
  }
  const from = requireDate('from', options.from ?? new Date());
  const record: FittingRecord = {
    id: crypto.randomUUID(), vesselId, role, instrumentId, from: exactIso(from), fromMs: from.getTime(),
    reason: requireText('reason', options.reason ?? '', 0, INSTRUMENT_TEXT_LIMITS.reason), enteredAt: now(),
  };
  await put('fittings', record, 'Saving the fitting');
  return record;
}

/** Fittings in the order they take effect: by `from`, the later entered after on a tie (ids are random, so the index alone would not say). */

/** A vessel's fittings, oldest first. */
export async function fittingsOfVessel(vesselId: string): Promise<FittingRecord[]> {
  requireUuid('vesselId', vesselId);
  const rows = await (await getDb()).getAllFromIndex('fittings', 'by-vessel', IDBKeyRange.bound([vesselId, -Infinity, ''], [vesselId, Infinity, '\uffff']));
  return rows.sort(byFrom);
}

/** Where an instrument has been fitted, oldest first. */
export async function fittingsOfInstrument(instrumentId: string): Promise<FittingRecord[]> {
  requireUuid('instrument id', instrumentId);
  const rows = await (await getDb()).getAllFromIndex('fittings', 'by-instrument', instrumentId);
  return rows.sort(byFrom);
}

/** A vessel's instruments in force now (or at `atMs`), each with its calibrations; a role taken off or never fitted is absent. */
export async function fittedInstruments(vesselId: string, atMs = Date.now()): Promise<Partial<Record<InstrumentRole, InstrumentHistory>>> {
  const current = fittedAt(await fittingsOfVessel(vesselId), atMs);
  const out: Partial<Record<InstrumentRole, InstrumentHistory>> = {};
  for (const role of INSTRUMENT_ROLES) {
    const id = current[role]?.instrumentId;
    if (!id) continue;
    const history = await instrumentHistory(id);
    if (history) out[role] = history;
  }
  return out;
}
