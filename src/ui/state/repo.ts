// The UI's only door to the store: small functions in the words the screens use.
import * as store from '../../store/index.ts';
import type { VesselSpec } from '../../core/index.ts';
import type { FittedForCheck, FittedInstrument } from '../../core/instrument/vessel-instruments.ts';
import type { CheckRecord, InstrumentHistory, JsonValue, NewCheck, VesselRecord } from '../../store/index.ts';
import { StoreError } from '../../store/index.ts';
import type { AppSettings } from './settings-model.ts';

export type { CheckRecord, VesselRecord } from '../../store/index.ts';

const SETTINGS_KEY = 'app-settings';

export function openAppStore(onEvent: (message: string) => void): Promise<void> {
  return store.openStore({
    onEvent(event) {
      if (event.type === 'blocked') onEvent('Another Tankside tab is open with an older version. Close it to continue.');
      if (event.type === 'closed-for-upgrade') onEvent('A newer version of Tankside was opened in another tab. Reload this page to continue.');
    },
  });
}

/** A store or core failure in words for the person (the store's messages already name the field). */
export function storageMessage(e: unknown): string {
  if (e instanceof StoreError) return e.message;
  if (e instanceof Error) return e.message;
  return String(e);
}

export async function loadSettings(): Promise<Partial<AppSettings>> {
  const stored = await store.getSetting(SETTINGS_KEY);
  return stored && typeof stored === 'object' && !Array.isArray(stored) ? (stored as Partial<AppSettings>) : {};
}

export function saveSettings(s: AppSettings): Promise<void> {
  return store.putSetting(SETTINGS_KEY, JSON.parse(JSON.stringify(s)) as JsonValue);
}

export function listVessels(includeRetired = true): Promise<VesselRecord[]> {
  return store.listVessels({ includeRetired });
}

export function getVessel(id: string): Promise<VesselRecord | undefined> {
  return store.getVessel(id);
}

/** `checkIntervalS`: how often the plant wants it checked, s; null for none. */
export function addVessel(tag: string, description: string, spec: VesselSpec, checkIntervalS: number | null = null): Promise<VesselRecord> {
  return store.addVessel({ tag, description, spec, checkIntervalS });
}

/** `checkIntervalS`: null clears it; absent keeps the stored one. */
export function updateVessel(id: string, tag: string, description: string, spec: VesselSpec, checkIntervalS?: number | null): Promise<VesselRecord> {
  return store.updateVessel(id, { tag, description, spec, ...(checkIntervalS === undefined ? {} : { checkIntervalS }) });
}


export function retireVessel(id: string): Promise<VesselRecord> {
  return store.retireVessel(id);
}

const savedListeners = new Set<() => void>();

/** Calls `listener` after each check saved (plant sync's trigger); it runs after the save, never inside it. */
export function onCheckSaved(listener: () => void): () => void {
  savedListeners.add(listener);
  return () => savedListeners.delete(listener);
}

/** Saves a check; `draftKey`, when given, is the draft of the entry, deleted in the same transaction. */
export async function appendCheck(check: NewCheck, draftKey?: string): Promise<CheckRecord> {
  const saved = await store.appendCheck(check, draftKey === undefined ? {} : { clearDraft: draftKey });
  for (const l of savedListeners) {
    try {
      l();
    } catch {
      // The check is saved; a listener's failure is not the save's.
    }
  }
  return saved;
}

/** The plant server this device syncs with, or null while sync is off. */
export function syncServer(): Promise<string | null> {
  return store.syncServer();
}

/** This install's device id, the account name its plant server knows it by. */
export function deviceId(): Promise<string> {
  return store.deviceId();
}

export function getCheck(id: string): Promise<CheckRecord | undefined> {
  return store.getCheck(id);
}

export async function recentChecks(limit = 100): Promise<CheckRecord[]> {
  return (await store.listChecks({ limit })).checks;
}

/** One vessel's checks, newest first (a retired vessel keeps them). */
export async function checksOfVessel(vesselId: string, limit = 20): Promise<CheckRecord[]> {
  return (await store.checksForVessel(vesselId, { limit })).checks;
}

export function saveDraft(key: string, value: unknown): Promise<void> {
  return store.saveDraft(key, JSON.parse(JSON.stringify(value)) as JsonValue);
}

export async function loadDraft<T>(key: string): Promise<T | undefined> {
  return (await store.loadDraft(key))?.value as T | undefined;
}

export function clearDraft(key: string): Promise<void> {
  return store.clearDraft(key);
}

/** The browser's answer about keeping this app's data, in words. */
export async function persistenceLabel(): Promise<string> {
  try {
    const p = await store.persistenceState();
    switch (p.state) {
      case 'persisted': return 'kept until you clear it (persistent)';
      case 'best-effort': return 'best effort: the browser may clear it when the phone runs short of space';
      case 'not-asked': return 'best effort (Tankside asks the browser to keep it at the first saved check)';
      case 'unsupported': return 'this browser cannot promise to keep it';
    }
  } catch (e) {
    return `unknown (${storageMessage(e)})`;
  }
}

/** How much this app stores and may store, in bytes (null where the browser does not say). */
export function storageUsage(): Promise<{ usageBytes: number | null; quotaBytes: number | null }> {
  return store.storageUsage();
}

/** When the log was last exported whole, and last consolidated. */
export function backupState(): Promise<store.BackupState> {
  return store.backupState();
}

/** Whether any check is saved on this device. */
export async function hasChecks(): Promise<boolean> {
  return (await store.countStoredChecks()) > 0;
}

/** The full backup (JSON) or the log as CSV, as a file to download. */
export async function exportFile(kind: 'backup' | 'csv'): Promise<{ name: string; blob: Blob }> {
  const stamp = store.formatIsoWithOffset(new Date()).slice(0, 10);
  if (kind === 'csv') {
    const { exportCsvParts } = await import('../../store/transfer.ts');
    return { name: `tankside-log-${stamp}.csv`, blob: new Blob(await exportCsvParts(), { type: 'text/csv' }) };
  }
  const { exportBackupParts } = await import('../../store/transfer.ts');
  return { name: `tankside-backup-${stamp}.json`, blob: new Blob(await exportBackupParts(), { type: 'application/json' }) };
}

/** Saves a record of another kind (a cycle, a periodic test); `draftKey`'s draft is deleted in the same transaction. */
export async function appendRecord(kind: store.RecordKind, record: store.NewKindRecord, draftKey?: string): Promise<store.KindRecord> {
  // Through the on-demand surface, as exportFile: only the cycle and test screens save these, and
  // their code stays out of the start-up JavaScript.
  const { appendRecord: append } = await import('../../store/transfer.ts');
  return append(kind, record, draftKey === undefined ? {} : { clearDraft: draftKey });
}

/** A register instrument as the core takes it: its spec and calibrations with their ids. */
export function fittedOf(h: InstrumentHistory): FittedInstrument {
  return { instrumentId: h.instrument.id, spec: h.instrument.spec, calibrations: h.calibrations.map((c) => ({ ...store.calibrationFigures(c), calibrationId: c.id })) };
}

/** The store's on-demand surface, where the register's reads and writes live (out of the start-up JavaScript). */
const onDemand = () => import('../../store/transfer.ts');

/** The vessel's instruments in force at `atMs` (now by default), each place's, for a check's band; {} for a vessel without a register. */
export async function fittedForCheck(vesselId: string, atMs = Date.now()): Promise<FittedForCheck> {
  const fitted = await (await onDemand()).fittedInstruments(vesselId, atMs);
  const out: FittedForCheck = {};
  for (const role of store.INSTRUMENT_ROLES) {
    const h = fitted[role];
    if (h) out[role] = fittedOf(h);
  }
  return out;
}

/** What a vessel's drift estimate reads: its newest 1,000 checks (the store's page limit), its fittings and the whole register by id. */
export async function driftInputs(vesselId: string): Promise<{ checks: CheckRecord[]; fittings: store.FittingRecord[]; register: Map<string, InstrumentHistory> }> {
  const register = await onDemand();
  const [page, fittings, histories] = await Promise.all([store.checksForVessel(vesselId, { limit: 1000 }), register.fittingsOfVessel(vesselId), register.listRegister()]);
  return { checks: page.checks, fittings, register: new Map(histories.map((h) => [h.instrument.id, h])) };
}

/** The whole register, each instrument with its calibrations. */
export async function listRegister(): Promise<InstrumentHistory[]> {
  return (await onDemand()).listRegister();
}

/** A vessel's fittings, oldest first. */
export async function fittingsOfVessel(vesselId: string): Promise<store.FittingRecord[]> {
  return (await onDemand()).fittingsOfVessel(vesselId);
}

/** One instrument with its calibrations, and where it has been fitted (oldest first). */
export async function instrumentPage(id: string): Promise<{ history: InstrumentHistory; fittings: store.FittingRecord[] } | undefined> {
  const register = await onDemand();
  const [history, fittings] = await Promise.all([register.instrumentHistory(id), register.fittingsOfInstrument(id)]);
  return history && { history, fittings };
}

/** Records a calibration; resolves once it is saved. */
export async function addCalibration(c: store.NewCalibration): Promise<store.CalibrationEntry> {
  return (await onDemand()).addCalibration(c);
}

/** The instrument register as a CSV file to download. */
export async function registerCsvFile(): Promise<{ name: string; blob: Blob }> {
  const stamp = store.formatIsoWithOffset(new Date()).slice(0, 10);
  const { exportRegisterCsv } = await import('../../store/transfer.ts');
  return { name: `tankside-instruments-${stamp}.csv`, blob: new Blob([await exportRegisterCsv()], { type: 'text/csv' }) };
}

