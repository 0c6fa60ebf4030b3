// A printable sheet of vessel labels: each active vessel's tag, description and a QR code that opens
// its new check. The QR encoder is in this screen's chunk only, loaded when the sheet is opened.
import { useSettings, useVessels } from '../state/app-state.ts';
import { isDemoVessel } from '../state/demo-label.ts';
import { plainDescription } from '../state/demo-label.ts';
import { labelLink } from './label-link.ts';
import { qrSymbol } from './qr-path.ts';
import './labels.css';

export function LabelsScreen() {
  useSettings();
  const vessels = useVessels().filter((v) => !v.retired);
  const base = window.location.href;
  return (
    <div class="labels-screen">
      <div class="no-print panel">
        <p>One label per vessel in service. Stick each where the gauge and thermometer are read; a phone's camera opens that vessel's new check, offline too once the app is installed.</p>
        <button type="button" class="primary" onClick={() => window.print()} disabled={vessels.length === 0}>Print the label sheet</button>
      </div>
      {vessels.length === 0 ? <p>No vessels in service yet.</p> : (
        <ul class="label-sheet" aria-label="Vessel labels">
          {vessels.map((v) => {
            const link = labelLink(base, v.id);
            const qr = qrSymbol(link);
            return (
              <li key={v.id} class="vessel-label" data-link={link}>
                <svg class="label-qr" viewBox={`0 0 ${qr.size} ${qr.size}`} role="img" aria-label={`QR code: new check of ${v.tag}`} shape-rendering="crispEdges">
                  <rect width={qr.size} height={qr.size} fill="#fff" />
                  <path d={qr.path} fill="#000" />
                </svg>
                <div class="label-text">
                  <strong class="label-tag">{v.tag}</strong>
                  {isDemoVessel(v) ? <span class="demo-tag">DEMO DATA</span> : null}
                  <span class="label-desc">{plainDescription(v.description)}</span>
                  <span class="label-hint">Scan for a new check · Tankside</span>
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
