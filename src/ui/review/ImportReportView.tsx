// What an import did: added and skipped, each with its reason; or, for a refused file, every record
// that refused it (nothing was written).
import type { ImportOutcome, ReportLine } from './transfer.ts';

function Lines({ title, lines, kind }: { title: string; lines: readonly ReportLine[]; kind: string }) {
  if (lines.length === 0) return null;
  const shown = lines.slice(0, 200);
  return (
    <details open={lines.length <= 20} class="import-lines">
      <summary>{title}: {lines.length.toLocaleString('en-GB')}</summary>
      <ul data-import={kind}>
        {shown.map((l) => <li key={l.key}><code>{l.label}</code>: {l.why}</li>)}
        {lines.length > shown.length ? <li>… and {lines.length - shown.length} more.</li> : null}
      </ul>
    </details>
  );
}

export function ImportReportView({ outcome }: { outcome: ImportOutcome }) {
  if (outcome.kind === 'cancelled') return <p role="status" data-import-result="cancelled">Import cancelled; nothing was changed.</p>;
  if (outcome.kind === 'refused') {
    return (
      <div role="alert" data-import-result="refused" data-import-refused={outcome.records.length}>
        <p class="field-error">{outcome.message}</p>
        <Lines title="Records that refuse the file" lines={outcome.records} kind="refused" />
      </div>
    );
  }
  const v = outcome.view;
  return (
    <div class="import-report" role="status" data-import-result="done">
      <p>
        <strong data-import-added={v.added}>Added {v.added.toLocaleString('en-GB')} checks</strong>
        {Object.entries(v.recordsAdded).map(([kind, n]) => <span key={kind} data-import-added-kind={kind}>, {n.toLocaleString('en-GB')} {kind} records</span>)}, {v.vesselsAdded} new
        vessels, {v.vesselsUpdated} vessels updated; skipped <span data-import-skipped={v.skipped.length}>{v.skipped.length}</span>.
      </p>
      {v.registerAdded + v.registerUpdated + v.registerSkipped > 0 ? (
        <p data-import-register={v.registerAdded}>Instrument register: {v.registerAdded} records added, {v.registerUpdated} updated, {v.registerSkipped} already here or kept as here.</p>
      ) : null}
      <Lines title="Skipped" lines={v.skipped} kind="skipped" />
      {v.signatures.length > 0 ? <ul class="import-signatures" data-import="signatures">{v.signatures.map((t) => <li key={t}>{t}</li>)}</ul> : null}
      {v.warnings.length + v.brokenChains.length > 0 ? (
        <ul class="import-warnings">
          {[...v.brokenChains.map((b) => `Chain in the file: ${b}`), ...v.warnings].map((w) => <li key={w}>{w}</li>)}
        </ul>
      ) : null}
    </div>
  );
}
