// Plant-wide sync with Apache CouchDB: the one entry of src/sync, loaded on demand by the app
// (like the store's long jobs). Talks to CouchDB and to the store's public surfaces, nothing else.
// README.md beside this file has the design and the words.
import { getSyncState, ownDeviceKeyText, recordBackup, updateSyncState, type LastSync, type SyncState } from '../store/transfer.ts';
import { formatIsoWithOffset } from '../store/index.ts';
import { Couch, DEFAULT_RETRY, type FetchLike, type RetryPolicy } from './couch.ts';
import { SyncError } from './errors.ts';
import { publishVesselEdits, type PublishResult } from './plant.ts';
import { pullChecks, pullPlant, refusedSummary, type ChecksPullResult, type PullProgress } from './pull.ts';
import { pushOwnChain, type PushProgress, type PushResult } from './push.ts';
import { publishRegister, type RegisterPublishResult } from './register.ts';

export { SyncError } from './errors.ts';
export type { SyncErrorKind } from './errors.ts';
export { DEFAULT_RETRY } from './couch.ts';
export type { FetchLike, RetryPolicy } from './couch.ts';
export { CHECKS_DB, PLANT_DB, recordDocId, vesselDocId } from './documents.ts';
export type { PushResult } from './push.ts';
export type { ChecksPullResult } from './pull.ts';
export type { PublishResult } from './plant.ts';
export type { RegisterPublishResult } from './register.ts';
export { registerDocId } from './documents.ts';

/** Which part of a sync is running. */
export type SyncStep = 'sign-in' | 'push' | 'publish' | 'pull-plant' | 'pull-checks';

export interface SyncProgress {
  step: SyncStep;
  /** Records done in this step. */
  done: number;
  /** Records in this step, when known. */
  total: number | null;
}

export interface SyncOptions {
  /** The platform's fetch (the browser's, or Node's in tests). */
  fetch: FetchLike;
  signal?: AbortSignal;
  onProgress?: (p: SyncProgress) => void;
  retry?: RetryPolicy;
  /** The person's name for vessel versions a supervisor publishes. */
  authorName?: string;
  /**
   * This device's public key record (canonical JSON), written once at seq 0 before its chain;
   * by default the store's own (ownDeviceKeyText), null to send none.
   */
  deviceKeyText?: string | null;
  /** Changes per pull request (default PULL_BATCH, 10,000). */
  pullBatch?: number;
}

/** What one sync did. */
export interface SyncReport {
  push: PushResult;
  /** A supervisor's vessel edits sent as new versions; null on a technician's device. */
  publish: PublishResult | null;
  /** The register's records sent: a supervisor's instruments, fittings and calibrations; a technician's calibrations. */
  registerPublished: RegisterPublishResult;
  plant: Awaited<ReturnType<typeof pullPlant>>;
  /** A supervisor's pull of every device's records; null on a technician's device. */
  checks: ChecksPullResult | null;
  /** Plain words for the status line. */
  message: string;
}

/** The enrolment an administrator gives a device (deploy/couch-account.mjs prints it). */
export interface Enrolment {
  server: string;
  account: string;
  password: string;
  role: 'technician' | 'supervisor';
}

/**
 * Saves the server, account and role this device syncs with (checked field by field; nothing is
 * saved when one is wrong). The account must be this device's id: the server's rules accept a
 * device's records only under its own name.
 * @throws StoreError('invalid-record') naming the field
 */
export async function enrol(enrolment: Enrolment): Promise<SyncState> {
  return updateSyncState({ server: enrolment.server, account: enrolment.account, password: enrolment.password, role: enrolment.role });
}

/**
 * One sync: sign in, push this device's new records, (supervisor) publish vessel edits, publish the
 * register's new records (a technician's device: its calibrations), pull the plant inventory and
 * register, (supervisor) pull every device's records. Saves the outcome as lastSync.
 * @throws SyncError with a plain-worded message (kind: offline, credentials, refused,
 *   chain-differs, server, cancelled, not-enrolled); StoreError from a local write
 */
export async function syncNow(options: SyncOptions): Promise<SyncReport> {
  const state = await getSyncState();
  if (!state.server || !state.account || !state.password || !state.role) {
    throw new SyncError('not-enrolled', 'This device is not enrolled for plant sync yet: enter the server, account and password the administrator gave.');
  }
  const couch = new Couch({
    server: state.server,
    account: state.account,
    password: state.password,
    fetch: options.fetch,
    retry: options.retry ?? DEFAULT_RETRY,
    signal: options.signal,
  });
  const progress = (step: SyncStep) => (p: PushProgress | PullProgress) =>
    options.onProgress?.({ step, done: p.done, total: 'total' in p ? p.total : p.pending === null ? null : p.done + p.pending });
  const supervisor = state.role === 'supervisor';
  let pushed = 0;
  let pulled = 0;
  // Until this push says otherwise, the server holds what it held after the last sync.
  let serverHead = state.lastSync?.serverHead;
  try {
    options.onProgress?.({ step: 'sign-in', done: 0, total: null });
    await couch.signIn();
    const deviceKeyText = options.deviceKeyText !== undefined ? options.deviceKeyText : await ownDeviceKeyText();
    const push = await pushOwnChain(couch, { signal: options.signal, onProgress: progress('push'), deviceKeyText });
    pushed = push.pushed;
    serverHead = push.serverHead;
    const publish = supervisor ? await publishVesselEdits(couch, state.account, options.authorName ?? '') : null;
    const registerPublished = await publishRegister(couch, state.account, supervisor);
    const plant = await pullPlant(couch, { signal: options.signal, onProgress: progress('pull-plant') });
    const checks = supervisor ? await pullChecks(couch, { signal: options.signal, onProgress: progress('pull-checks'), batch: options.pullBatch }) : null;
    pulled = checks?.added.length ?? 0;
    const report: SyncReport = { push, publish, registerPublished, plant, checks, message: summary(push, plant, checks) };
    await saveOutcome({ outcome: 'ok', pushed, pulled, message: report.message, ...(serverHead === undefined ? {} : { serverHead }) });
    return report;
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const outcome = error instanceof SyncError && error.kind === 'cancelled' ? 'cancelled' : 'failed';
    await saveOutcome({ outcome, pushed, pulled, message, ...(serverHead === undefined ? {} : { serverHead }) }).catch(() => {});
    throw error;
  }
}

function summary(push: PushResult, plant: SyncReport['plant'], checks: ChecksPullResult | null): string {
  const parts = [
    push.localHead === 0
      ? 'No records saved on this device yet'
      : `${push.pushed} record${push.pushed === 1 ? '' : 's'} sent (checks, cycles, tests); all ${push.localHead} of this device's are on the server`,
  ];
  if (plant.applied.length > 0) parts.push(`${plant.applied.length} vessel definition${plant.applied.length === 1 ? '' : 's'} updated`);
  const reg = plant.register.added + plant.register.updated;
  if (reg > 0) parts.push(`${reg} instrument register record${reg === 1 ? '' : 's'} received (instruments, calibrations, fittings)`);
  if (plant.conflicts.length > 0) parts.push(`${plant.conflicts.length} vessel definition${plant.conflicts.length === 1 ? '' : 's'} need a supervisor (two edits of one version, or an edit here)`);
  if (checks) {
    parts.push(`${checks.added.length} record${checks.added.length === 1 ? '' : 's'} received`);
    if (checks.gaps.length > 0) parts.push(`${checks.gaps.length} gap${checks.gaps.length === 1 ? '' : 's'} in other devices' chains`);
  }
  const refused = refusedSummary([...plant.refused, ...(checks?.refused ?? [])]);
  if (refused) parts.push(refused);
  return `${parts.join('; ')}.`;
}

async function saveOutcome(last: Omit<LastSync, 'at'>): Promise<void> {
  const at = formatIsoWithOffset(new Date());
  await updateSyncState({ lastSync: { at, ...last } });
  // An ok sync has pushed every check of this device: the log is consolidated, which the storage
  // panel and the backup reminder count as a backup.
  if (last.outcome === 'ok') await recordBackup('consolidation', at).catch(() => undefined);
}

/**
 * Runs syncs one at a time: a request while one runs asks for one more run after it (saves made
 * during a push go up in the next), never two at once. For the app's triggers: launch, `online`,
 * and each save while online.
 */
export class SyncRunner {
  private running: Promise<void> | null = null;
  private again = false;

  constructor(private readonly run: () => Promise<unknown>, private readonly onError: (error: unknown) => void = () => {}) {}

  /** Asks for a sync; resolves when no run is pending any more. */
  request(): Promise<void> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    const loop = async () => {
      do {
        this.again = false;
        try {
          await this.run();
        } catch (error) {
          this.onError(error);
        }
      } while (this.again);
    };
    this.running = loop().finally(() => {
      this.running = null;
    });
    return this.running;
  }
}
