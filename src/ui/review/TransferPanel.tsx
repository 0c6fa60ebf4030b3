// Export (CSV, JSON backup) and import of a backup from another device, with the import's report.
import { useState } from 'preact/hooks';
import { StoreError, type CheckFilter } from '../../store/index.ts';
import { WorkProgress } from './WorkProgress.tsx';
import { fileSizeText, importFile, makeExport, offerDownload, type ExportKind, type ImportOutcome } from './transfer.ts';
import { useLongWork } from './use-long-work.ts';
import { ImportReportView } from './ImportReportView.tsx';

/** `filter`: the Review's filter as the store takes it; when it narrows the log, a CSV of its checks alone can be made too. */
export function TransferPanel({ onBusy, onImported, filter = {} }: { onBusy(busy: boolean): void; onImported(): void; filter?: CheckFilter }) {
  const work = useLongWork();
  // What the last export came to, said in words and, for tests, in data-export-result.
  const [message, setMessage] = useState<{ text: string; result: 'ready' | 'cancelled' | 'failed' } | null>(null);
  const [outcome, setOutcome] = useState<ImportOutcome | null>(null);
  const [file, setFile] = useState<File | null>(null);
  const [runs, setRuns] = useState(0);
  const busy = work.running !== null;

  const narrowed = Object.keys(filter).length > 0;
  const exportAs = async (kind: ExportKind, selection = false) => {
    setMessage(null);
    try {
      const label = kind === 'csv' ? (selection ? 'Writing the CSV of the filtered checks' : 'Writing the CSV') : 'Writing the backup';
      const made = await work.run(label, (o) => makeExport(kind, selection ? { ...o, filter } : o));
      if (made) {
        offerDownload(made);
        setMessage({ text: `Ready: ${made.name} (${fileSizeText(made.size)}).`, result: 'ready' });
      }
    } catch (e) {
      if (e instanceof StoreError && e.code === 'cancelled') setMessage({ text: 'Export cancelled; no file was made.', result: 'cancelled' });
      else setMessage({ text: `Export stopped: ${e instanceof Error ? e.message : String(e)}`, result: 'failed' });
    }
  };
  const runImport = async () => {
    if (!file) return;
    setOutcome(null);
    onBusy(true);
    const result = await work.run('Importing the backup', (o) => importFile(file, o));
    onBusy(false);
    if (result) {
      setOutcome(result);
      setRuns((n) => n + 1);
      if (result.kind === 'done') onImported();
    }
  };

  return (
    <section class="panel no-print" aria-labelledby="review-transfer-title">
      <h2 id="review-transfer-title">Export and import</h2>
      <div class="row">
        <button type="button" onClick={() => void exportAs('csv')} disabled={busy}>Download CSV</button>
        {narrowed ? <button type="button" onClick={() => void exportAs('csv', true)} disabled={busy}>Filtered checks as CSV</button> : null}
        <button type="button" onClick={() => void exportAs('json')} disabled={busy}>Download JSON backup</button>
      </div>
      <p aria-live="polite" data-export-message data-export-result={message?.result}>{message?.text ?? ''}</p>
      <div class="field">
        <label for="rt-file">Backup file from another device</label>
        <input id="rt-file" class="file-input" type="file" accept=".json,application/json" disabled={busy}
          onChange={(e) => setFile((e.currentTarget as HTMLInputElement).files?.[0] ?? null)} />
        <p class="hint">The whole file is checked before anything is written. If any record fails its hash, its link to the record before it or its seq, nothing is imported and every such record is listed.</p>
      </div>
      <button type="button" class="primary" onClick={() => void runImport()} disabled={busy || !file}>Import and merge</button>
      <WorkProgress work={work} id="transfer-progress" />
      {outcome ? <div data-import-run={runs}><ImportReportView outcome={outcome} /></div> : null}
    </section>
  );
}
