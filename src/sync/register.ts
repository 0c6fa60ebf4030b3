// The instrument register over the plant server (README, "The register"): a supervisor's device
// publishes its instruments (each edit a new document, author in its id, as vessel versions are),
// fittings and calibrations; a technician's device publishes only the calibrations entered on it;
// every device pulls them all with the plant inventory. Calibrations and fittings are append-only
// documents, written once under their record's id.
import { recordRegisterPublished, registerToPublish, type RegisterDocType } from '../store/register-sync.ts';
import type { Couch } from './couch.ts';
import { PLANT_DB, registerDoc } from './documents.ts';
import { sendDocs } from './push.ts';

/** What publishing the register sent, by kind. */
export interface RegisterPublishResult {
  instruments: number;
  calibrations: number;
  fittings: number;
}

/** The kinds each role publishes: a technician's device only its calibrations (the server refuses the rest from it). */
export function publishedKinds(supervisor: boolean): RegisterDocType[] {
  return supervisor ? ['instrument', 'calibration', 'fitting'] : ['calibration'];
}

/**
 * Sends the register's records not yet on the server from this device, the account as author.
 * @throws SyncError('refused') with the server's reason, and as sendDocs
 */
export async function publishRegister(couch: Couch, account: string, supervisor: boolean): Promise<RegisterPublishResult> {
  const items = await registerToPublish(publishedKinds(supervisor));
  const result: RegisterPublishResult = { instruments: 0, calibrations: 0, fittings: 0 };
  if (items.length === 0) return result;
  await sendDocs(couch, items.map((i) => registerDoc(i, account)), PLANT_DB);
  await recordRegisterPublished(items);
  for (const i of items) result[i.type === 'instrument' ? 'instruments' : i.type === 'calibration' ? 'calibrations' : 'fittings'] += 1;
  return result;
}
