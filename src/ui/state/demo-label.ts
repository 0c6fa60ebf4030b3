// How the app tells demo data from a real vessel's: the tag prefix DEMO- or a description that
// starts "DEMO DATA:" (both set by the demo plant). Either is enough, so a demo vessel renamed in
// one place, or a saved check's vessel snapshot, is still labelled.

export const DEMO_TAG_PREFIX = 'DEMO-';
export const DEMO_DESCRIPTION_PREFIX = 'DEMO DATA:';

/** True for a demo vessel (a vessel record, its spec, or a check's vessel snapshot). */
export function isDemo(v: { tag?: unknown; description?: unknown } | null | undefined): boolean {
  if (!v) return false;
  return (typeof v.tag === 'string' && v.tag.startsWith(DEMO_TAG_PREFIX))
    || (typeof v.description === 'string' && v.description.startsWith(DEMO_DESCRIPTION_PREFIX));
}

/** True for a demo vessel record (its own tag and description, or its spec's). */
export function isDemoVessel(v: { tag?: unknown; description?: unknown; spec?: unknown }): boolean {
  return isDemo(v) || isDemo(v.spec as { tag?: unknown; description?: unknown } | undefined);
}

/** The description without its "DEMO DATA:" prefix (the label is shown on its own). */
export function plainDescription(description: string): string {
  return description.startsWith(DEMO_DESCRIPTION_PREFIX) ? description.slice(DEMO_DESCRIPTION_PREFIX.length).trimStart() : description;
}

/** The words shown beside the DEMO DATA label on every demo result. */
export const DEMO_RESULT_NOTICE = 'An invented vessel for trying the app. These figures describe no real vessel.';
