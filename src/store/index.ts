// The store's public surface: the rest of the app uses only what is exported here and never sees
// IndexedDB. All writes use strict durability and resolve only after their transaction committed.

// Connection
export { openStore, closeStore } from './connection.ts';
export type { OpenStoreOptions, StoreEvent } from './connection.ts';

// Errors
export { StoreError } from './errors.ts';
export type { RefusedRecord, StoreErrorCode } from './errors.ts';

// Records
export { GENESIS_HASH, isCheckRecord } from './records.ts';
export type {
  CheckCursor,
  CheckPage,
  CheckRecord,
  IsoDateTime,
  KindRecord,
  KindRecordPage,
  LogRecord,
  NewKindRecord,
  JsonObject,
  JsonValue,
  LongWorkOptions,
  NewCheck,
  NewVessel,
  StoredCaution,
  TypedInput,
  VesselPatch,
  VesselRecord,
  VesselSpecData,
} from './records.ts';

// Vessels
export { addVessel, updateVessel, retireVessel, getVessel, listVessels, CHECK_INTERVAL_RANGE_S } from './vessels.ts';

// Instrument register (calibrations and fittings append-only): its records' shapes and pure helpers
// here; its reads and writes (instruments.ts) on the on-demand surface, ./transfer.ts, so the
// Check screen's first paint does not wait for them.
export { INSTRUMENT_KIND_IDS, INSTRUMENT_ROLES, INSTRUMENT_TEXT_LIMITS, KINDS_OF_ROLE, calibrationFigures, fittedAt } from './instrument-records.ts';
export type {
  CalibrationEntry, FittingRecord, InstrumentHistory, InstrumentOrigin, InstrumentRecord, InstrumentRole, NewCalibration, NewInstrument,
} from './instrument-records.ts';

// Checks (append-only)
export { appendCheck, getCheck, listChecks, checksForVessel, queryChecks, countStoredChecks, correctionsOf } from './checks.ts';
export type { AppendOptions, CheckFilter, ListOptions } from './checks.ts';
// The desk's reads (latestChecks, latestOfKind, sortChecks) are in ./desk.ts, loaded on demand.
export {
  OUTCOME_IDS, SIGNAL_ORDER, VERDICT_IDS, findingMaskOf, isStandingRuleId, outcomeOfMask, outcomeOfRecord, signalMaskOf, verdictOfResult, worstSignalOfMask,
} from './facts.ts';
export type { Signal, StoredOutcome, StoredVerdict } from './facts.ts';

// Records of other kinds (cycles, periodic tests …), in the same chain
export { appendRecord, getRecord, listRecords, countRecords } from './kind-records.ts';
export type { AppendRecordOptions, KindFilter } from './kind-records.ts';
export { RECORD_KINDS, isKnownKind } from './record-kinds.ts';
export type { RecordKind } from './record-kinds.ts';

// Settings, drafts, device, persistence
export {
  getSetting,
  putSetting,
  saveDraft,
  loadDraft,
  clearDraft,
  deviceId,
  syncServer,
  requestPersistence,
  persistenceState,
  backupState,
  storageUsage,
} from './settings.ts';
export type { BackupState, PersistenceState } from './settings.ts';

// Integrity (the long jobs — backup, CSV, verifying the stored log — are in ./transfer.ts, loaded on demand)
export { verifyChains, canonicalJson, computeCheckHash } from './integrity.ts';
export type { ChainProblem, ChainStatus } from './integrity.ts';

// Time
export { formatIsoWithOffset, parseIsoWithOffset } from './time.ts';
