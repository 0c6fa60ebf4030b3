// Scanning a vessel's QR label with the phone's camera inside the app, where the browser offers
// BarcodeDetector (the Shape Detection API). The camera stops as soon as a label is read, on Cancel
// and when the component goes away. Anything that is not one of our labels is said so and ignored.
import { useEffect, useRef, useState } from 'preact/hooks';
import { vesselIdOfLabel } from './label-link.ts';

interface Detector { detect(source: CanvasImageSource): Promise<{ rawValue: string }[]> }
type DetectorClass = new (options: { formats: string[] }) => Detector;

interface Props { onVessel: (vesselId: string) => void; onClose: () => void }

export function ScanLabel({ onVessel, onClose }: Props) {
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
          const id = vesselIdOfLabel(code.rawValue);
          if (id) { live = false; onVessel(id); return; }
          setMessage('That code is not a Tankside vessel label.');
        }
      } catch { /* a frame not ready yet */ }
      if (live) requestAnimationFrame(() => void look());
    };
    navigator.mediaDevices.getUserMedia({ video: { facingMode: 'environment' } }).then(async (s) => {
      stream = s;
      if (!live || !video.current) return;
      video.current.srcObject = s;
      await video.current.play();
      setMessage('Point the camera at the vessel\'s label.');
      void look();
    }, (e: unknown) => setMessage(`The camera could not be opened (${e instanceof Error ? e.message : String(e)}). Type the tag instead.`));
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
