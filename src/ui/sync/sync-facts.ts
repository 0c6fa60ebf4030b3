// Between the Sync screen and the sync client: what the status panel shows (read from the store's
// sync state and this device's chain head) and the two changes a person makes, enrolling and
// leaving plant sync. This module is the screen's own chunk, with the sync client.
import { enrol, type Enrolment } from '../../sync/index.ts';
import { getSyncState, ownChainHead, updateSyncState, type LastSync } from '../../store/transfer.ts';
import { setSyncServer } from '../state/sync-status.ts';

export interface SyncFacts {
  deviceId: string;
  server: string | null;
  account: string | null;
  role: 'technician' | 'supervisor' | null;
  lastSync: LastSync | null;
  /** This device's records saved here: its chain's head seq (0 before the first). */
  localHead: number;
  /** Local head − server head; null until a sync has read the server's head. */
  pending: number | null;
}

export async function readSyncFacts(): Promise<SyncFacts> {
  const [state, own] = await Promise.all([getSyncState(), ownChainHead()]);
  const localHead = own.head?.seq ?? 0;
  const serverHead = state.lastSync?.serverHead;
  return {
    deviceId: own.deviceId,
    server: state.server,
    account: state.account,
    role: state.role,
    lastSync: state.lastSync,
    localHead,
    pending: serverHead === undefined ? null : Math.max(0, localHead - serverHead),
  };
}

/** Saves the enrolment and turns sync on (the footer then names the server). @throws StoreError naming the field */
export async function enrolDevice(e: Enrolment): Promise<void> {
  await enrol(e);
  setSyncServer(e.server);
}

/**
 * Turns plant sync off on this device: the server, account and password are forgotten; the checks,
 * the pull checkpoints and the last outcome stay (enrolling again resumes from the server's head).
 */
export async function leaveSync(): Promise<void> {
  await updateSyncState({ server: null, account: null, password: null, role: null });
  setSyncServer(null);
}
