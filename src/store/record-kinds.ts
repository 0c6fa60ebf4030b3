// The kinds of record, beside checks, that this version of the app keeps in a device's chain
// (BACKUP-FORMAT.md, "Records of other kinds"). A kind not listed here is still verified where it
// is met (hash, links, signature) and skipped, as older versions skip the kinds listed here: a
// later version's records never break this one. To add a kind, add its name here and say in
// src/store/README.md which room writes it; the store keeps its `values` as plain JSON and never
// reads inside them.

/**
 * Kinds kept: `cycle`, a sterilising cycle's readings, limits, evaluation and cautions
 * (src/ui/cycles); `periodic-test`, one steam-supply or chamber test with its result (its
 * `values.test` names which); `review-note`, a supervisor's note on a vessel's findings: who
 * (`technician`), when (`time`), what was decided (`note`), on which vessel and check (`values`:
 * checkId, outcome, findingSignals, the check's time), written from the plant overview (src/ui/desk).
 */
export const RECORD_KINDS = ['cycle', 'periodic-test', 'review-note'] as const;
export type RecordKind = (typeof RECORD_KINDS)[number];

/** The form a kind's name takes, as the plant server's rules require of a document's type (deploy/design). */
export const KIND_NAME = /^[a-z][a-z0-9-]{0,31}$/;

/** Whether this version keeps records of `kind`. */
export function isKnownKind(kind: unknown): kind is RecordKind {
  return typeof kind === 'string' && (RECORD_KINDS as readonly string[]).includes(kind);
}
