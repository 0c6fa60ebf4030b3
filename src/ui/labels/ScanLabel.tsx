// Scanning a QR code with the phone's camera inside the app, where the browser offers
// BarcodeDetector (the Shape Detection API): a vessel's label (ScanLabel), or an enrolment code
// for plant sync (ScanCode, used by the Sync screen). The camera stops as soon as a code is read,
// on Cancel and when the component goes away. Anything that is not what is asked for is said so
// and ignored.
import { useEffect, useRef, useState } from 'preact/hooks';
import { vesselIdOfLabel } from './label-link.ts';

interface Detector { detect(source: CanvasImageSource): Promise<{ rawValue: string }[]> }
type DetectorClass = new (options: { formats: string[] }) => Detector;

interface Props { onVessel: (vesselId: string) => void; onClose: () => void }

export function ScanLabel({ onVessel, onClose }: Props) {
  return (
    <ScanCode read={(t) => vesselIdOfLabel(t) !== undefined} onText={(t) => onVessel(vesselIdOfLabel(t)!)} onClose={onClose}
      notOurs="That code is not a Tankside vessel label." typeInstead="Type the tag instead." aimAt="the vessel's label" />
  );
}

interface CodeProps {
  /** Whether a code's text is what is asked for. */
  read: (text: string) => boolean;
  onText: (text: string) => void;
  onClose: () => void;
  /** Said when a code is something else. */
  notOurs: string;
  /** Said when the camera cannot be opened. */
  typeInstead: string;
  /** What to point the camera at. */
  aimAt?: string;
}

export function ScanCode({ read, onText, onClose, notOurs, typeInstead, aimAt = 'the code' }: CodeProps) {
  const video = useRef<HTMLVideoElement>(null);
  const [message, setMessage] = useState('Starting the camera…');
  useEffect(() => {
    let stream: MediaStream | undefined;
    let live = true;
    const Barcode = (window as unknown as { BarcodeDetector: DetectorClass }).BarcodeDetector;
    const detector = new Barcode({ formats: ['qr_code'] });
    const look = async () => {
      if (!live || !video.current) return;
      try {
        for (const code of await detector.detect(video.current)) {
          if (read(code.rawValue)) { live = false; onText(code.rawValue); return; }
          setMessage(notOurs);
        }
      } catch { /* a frame not ready yet */ }
      if (live) requestAnimationFrame(() => void look());
    };
    navigator.mediaDevices.getUserMedia({ video: { facingMode: 'environment' } }).then(async (s) => {
      stream = s;
      if (!live || !video.current) return;
      video.current.srcObject = s;
      await video.current.play();
      setMessage(`Point the camera at ${aimAt}.`);
      void look();
    }, (e: unknown) => setMessage(`The camera could not be opened (${e instanceof Error ? e.message : String(e)}). ${typeInstead}`));
    return () => {
      live = false;
      stream?.getTracks().forEach((t) => t.stop());
    };
  }, []);
  return (
    <div class="scan-view" data-scan-state={message.startsWith('Point') ? 'scanning' : 'starting'}>
      <video ref={video} muted playsInline aria-label="Camera view" />
      <p role="status">{message}</p>
      <button type="button" onClick={onClose}>Cancel scanning</button>
    </div>
  );
}
