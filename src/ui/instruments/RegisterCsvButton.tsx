// The register as a spreadsheet file: one row per calibration, SI figures (src/store/register-csv.ts).
import { useState } from 'preact/hooks';
import * as repo from '../state/repo.ts';
import { downloadFile } from '../components/download.ts';

export function RegisterCsvButton() {
  const [message, setMessage] = useState('');
  const exportNow = async () => {
    try {
      const file = await repo.registerCsvFile();
      downloadFile(file);
      setMessage(`Exported ${file.name}.`);
    } catch (e) {
      setMessage(`Export failed: ${repo.storageMessage(e)}`);
    }
  };
  return (
    <div class="field">
      <button type="button" onClick={() => void exportNow()}>Export the register (CSV)</button>
      <p aria-live="polite">{message}</p>
    </div>
  );
}
