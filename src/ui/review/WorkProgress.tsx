// Progress of a long job with its cancel button; cancelling leaves nothing half-done (the store
// writes all or nothing).
import type { LongWork } from './use-long-work.ts';

export function WorkProgress({ work, id }: { work: LongWork; id: string }) {
  if (!work.running) return null;
  const known = work.total > 0;
  return (
    <div class="work-progress" role="status">
      <label class="label" for={id}>{work.running}{known ? `: ${work.done.toLocaleString('en-GB')} of ${work.total.toLocaleString('en-GB')}` : '…'}</label>
      {known ? <progress id={id} max={work.total} value={work.done} /> : <progress id={id} />}
      <button type="button" class="danger" onClick={work.cancel}>Cancel</button>
    </div>
  );
}
