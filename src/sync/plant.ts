// A supervisor's vessel edits go up as new versions of the plant inventory: each edit is a new
// document (version + author in its id), so two supervisors' edits of one version both stay on the
// server and every device sees the clash, rather than one overwriting the other.
import { recordPublished, vesselEditsToPublish, type PlantConflict } from '../store/transfer.ts';
import type { Couch } from './couch.ts';
import { PLANT_DB, vesselDoc } from './documents.ts';
import { sendDocs } from './push.ts';

/** What publishing did. */
export interface PublishResult {
  /** Vessel versions the server now holds from this device. */
  published: { vesselId: string; tag: string; version: number; label: string }[];
  /** Vessels edited here whose newer version from someone else is not applied here: not sent. */
  blocked: PlantConflict[];
}

/**
 * Sends every vessel edited on this supervisor's device since the version last applied here as
 * the next version, with the account as author and `authorName` as the person's name.
 * @throws SyncError('refused') when the account is not a supervisor's (the server's reason), and as sendDocs
 */
export async function publishVesselEdits(couch: Couch, account: string, authorName: string): Promise<PublishResult> {
  const { edits, blocked } = await vesselEditsToPublish(account, authorName);
  if (edits.length === 0) return { published: [], blocked };
  const docs = edits.map((e) => vesselDoc(e.entry, e.text));
  await sendDocs(couch, docs, PLANT_DB);
  await recordPublished(edits.map((e, i) => ({ label: docs[i]!._id, entry: e.entry })));
  return {
    published: edits.map((e, i) => ({ vesselId: e.entry.vesselId, tag: e.entry.vessel.tag, version: e.entry.version, label: docs[i]!._id })),
    blocked,
  };
}
