// Export and import for the review screen: file names, downloads, reading a chosen file, and the
// import report in words. The store does the work (exportBackupParts, exportCsvParts, importBackup).
import { StoreError, type CheckFilter, type LongWorkOptions, type RefusedRecord } from '../../store/index.ts';
import { exportBackupParts, exportCsvParts, importBackupFile, type ImportReport } from '../../store/transfer.ts';

export type ExportKind = 'csv' | 'json';

/** A file name with the local date and time, e.g. tankside-log-2026-12-01T2205.csv. */
export function exportFileName(kind: ExportKind, now: Date): string {
  const p = (n: number) => String(n).padStart(2, '0');
  const stamp = `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}T${p(now.getHours())}${p(now.getMinutes())}`;
  return kind === 'csv' ? `tankside-log-${stamp}.csv` : `tankside-backup-${stamp}.json`;
}

/** Runs an export and returns the file to hand to the browser. */
export async function makeExport(kind: ExportKind, options: LongWorkOptions & { vesselId?: string; filter?: CheckFilter }): Promise<File> {
  // Pieces, not one string: the browser builds the file from them without a copy of it all.
  const parts = kind === 'csv' ? await exportCsvParts(options) : await exportBackupParts(options);
  const type = kind === 'csv' ? 'text/csv;charset=utf-8' : 'application/json';
  return new File(parts, exportFileName(kind, new Date()), { type });
}

/** A file size for people, e.g. "1,234 KB". */
export function fileSizeText(bytes: number): string {
  return `${Math.ceil(bytes / 1024).toLocaleString('en-GB')} KB`;
}

/** Offers a file as a download (an object URL; nothing leaves the device). */
export function offerDownload(file: File): void {
  const url = URL.createObjectURL(file);
  const a = document.createElement('a');
  a.href = url;
  a.download = file.name;
  a.click();
  // The URL keeps the whole file in the browser's memory while it lives (over 100 MB for a large
  // log, a lot on a phone); the download has taken hold of it well within seconds of the click.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** One line of an import report: what it is about (a record id, or where a record is missing) and why. */
export interface ReportLine { key: string; label: string; why: string }

export interface ImportView {
  added: number;
  /** Records of other kinds added (cycles, periodic tests), by kind. */
  recordsAdded: Record<string, number>;
  vesselsAdded: number;
  vesselsUpdated: number;
  /** Instrument register records (instruments, calibrations, fittings) added or updated. */
  registerAdded: number;
  registerUpdated: number;
  registerSkipped: number;
  skipped: ReportLine[];
  warnings: string[];
  brokenChains: string[];
  /** Per device of the file: who signed its records, or that they are unsigned. */
  signatures: string[];
}

export function importView(r: ImportReport): ImportView {
  return {
    added: r.checks.added.length,
    recordsAdded: r.records.added.reduce<Record<string, number>>((n, a) => ({ ...n, [a.kind]: (n[a.kind] ?? 0) + 1 }), {}),
    vesselsAdded: r.vessels.added.length,
    vesselsUpdated: r.vessels.updated.length,
    // A report made by an import of before the register has no register part.
    registerAdded: r.register?.added ?? 0,
    registerUpdated: r.register?.updated ?? 0,
    registerSkipped: r.register?.skipped.length ?? 0,
    skipped: [...r.vessels.skipped.map((s) => ({ key: s.id, label: s.id, why: `vessel: ${s.why}` })), ...r.checks.skipped.map((s) => ({ key: s.id, label: s.id, why: s.why })), ...r.records.skipped.map((s) => ({ key: s.id, label: s.id, why: s.why }))],
    warnings: r.warnings,
    brokenChains: r.fileChains.filter((c) => c.status === 'broken').map((c) => `device ${c.deviceId.slice(0, 8)}: ${c.status === 'broken' ? c.detail : ''}`),
    signatures: r.fileSignatures.map(({ deviceId, signature: s }) => {
      const device = `device ${deviceId.slice(0, 8)}`;
      if (s.state === 'signed') return `Records of ${device} up to seq ${s.throughSeq} signed by ${device} (key fingerprint ${s.fingerprint}).`;
      if (s.state === 'unsigned') return `Records of ${device} are not signed (saved before the device signed its records).`;
      return `Records of ${device} up to seq ${s.throughSeq} signed; ${s.detail}.`;
    }),
  };
}

/** Each record that refused a file, named by device and seq (and id when there is one). */
export function refusedLines(refused: readonly RefusedRecord[]): ReportLine[] {
  return refused.map((r) => ({
    key: `${r.deviceId} ${r.seq}`,
    label: `device ${r.deviceId.slice(0, 8)} seq ${r.seq}${r.id ? ` (${r.id})` : ''}`,
    why: r.why,
  }));
}

export type ImportOutcome =
  | { kind: 'done'; view: ImportView }
  /** Nothing was written; `records` lists every record that refused the file (empty when the file itself is unreadable). */
  | { kind: 'refused'; message: string; records: ReportLine[] }
  | { kind: 'cancelled' };

/** Reads a chosen backup file and merges it (on a worker: the page stays free); a refused or cancelled import changed nothing. */
export async function importFile(file: File, options: LongWorkOptions): Promise<ImportOutcome> {
  try {
    return { kind: 'done', view: importView(await importBackupFile(file, options)) };
  } catch (e) {
    if (e instanceof StoreError && e.code === 'cancelled') return { kind: 'cancelled' };
    const records = e instanceof StoreError ? refusedLines(e.refused) : [];
    return { kind: 'refused', message: e instanceof Error ? e.message : String(e), records };
  }
}
