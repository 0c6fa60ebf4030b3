// The store's second public surface: the long jobs — backup export and import-and-merge, CSV
// export, chain verification over the stored log, and what plant sync (src/sync) needs of the
// store (sync-log.ts). The app loads it on demand (the Review screen, the Settings download, the
// sync client), so a technician's phone does not parse the backup validator at start. Same rules
// as src/store/index.ts: the rest of the app never sees IndexedDB.
export { verifyStoredChains } from './verify.ts';
export type { StoredChainStatus } from './verify.ts';
export type { SignatureStatus } from './signatures.ts';
export { exportBackup, exportBackupParts, importBackup, parseBackup, BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_LIMITS } from './backup.ts';
export type { BackupDocument, BackupLimits, ChainHead, ImportReport } from './backup.ts';
export { importBackupFile } from './import-job.ts';
export { recordBackup } from './backup-record.ts';
export { exportCsv, exportCsvParts, csvFromChecks } from './csv.ts';
export { exportRegisterCsv, REGISTER_CSV_COLUMNS } from './register-csv.ts';
export { tallyChecks } from './tally.ts';
export { isKnownKind, RECORD_KINDS } from './record-kinds.ts';
// Also on index.ts; here for the screens that save them, so they load with those screens.
export { appendRecord, listRecords } from './kind-records.ts';
export type { CheckTally } from './tally.ts';
// The instrument register's reads and writes: loaded when first asked for (a check's band once a
// vessel is chosen, drift, the Instruments screens), not with the Check screen's first paint. A
// surface of their own was measured and made the start larger (the bundler split the start-up
// store into two chunks).
export {
  addInstrument, updateInstrument, retireInstrument, getInstrument, listInstruments, addCalibration, calibrationsOf, instrumentHistory,
  listRegister, fitInstrument, fittingsOfVessel, fittingsOfInstrument, fittedInstruments,
} from './instruments.ts';
export {
  ownChainHead,
  ownRecords,
  mergePulledRecords,
  linksAround,
  getSyncState,
  updateSyncState,
  applyVesselVersions,
  vesselEditsToPublish,
  recordPublished,
} from './sync-log.ts';
export { learnDeviceKeys, ownDeviceKeyText } from './sync-keys.ts';

export type { DeviceKeyRecord, KeyLearnReport } from './sync-keys.ts';
export type {
  LastSync,
  LinkProblem,
  OwnRecord,
  PlantConflict,
  PlantReport,
  PulledRecord,
  PulledVersion,
  PullMergeReport,
  SyncState,
  VesselEdit,
  VesselVersion,
} from './sync-log.ts';
