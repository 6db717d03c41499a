import { useEffect, useRef, useState } from 'react';
import type { IScannerControls } from '@zxing/browser';
import { Button } from '../../../../components/Button';

const cameraAvailable = () => typeof navigator !== 'undefined' && Boolean(navigator.mediaDevices?.getUserMedia);

/**
 * Reads a barcode with the device camera. The reader is loaded only when the camera starts,
 * so scanner-gun stations never download it. The first code read ends the session.
 */
export function CameraScanButton({ onScan }: { onScan: (serial: string) => void }) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const controlsRef = useRef<IScannerControls | null>(null);
  const [active, setActive] = useState(false);
  const [problem, setProblem] = useState<string>();

  const stop = () => {
    controlsRef.current?.stop();
    controlsRef.current = null;
    setActive(false);
  };

  useEffect(() => () => controlsRef.current?.stop(), []);

  const start = async () => {
    setProblem(undefined);
    setActive(true);
    try {
      const { BrowserMultiFormatReader } = await import('@zxing/browser');
      const reader = new BrowserMultiFormatReader();
      controlsRef.current = await reader.decodeFromVideoDevice(undefined, videoRef.current ?? undefined, (result, _error, controls) => {
        if (!result) return;
        controls.stop();
        controlsRef.current = null;
        setActive(false);
        onScan(result.getText().trim());
      });
    } catch {
      setActive(false);
      setProblem('The camera could not be started. Allow camera access, or scan with the barcode reader.');
    }
  };

  if (!cameraAvailable()) return null;
  return (
    // `contents`: the button sits in the scan row and the camera view wraps onto its own line below it.
    <div className="contents">
      {active ? (
        <Button variant="secondary" size="glove" onClick={stop}>
          Stop camera
        </Button>
      ) : (
        <Button variant="secondary" size="glove" onClick={() => void start()}>
          Scan with camera
        </Button>
      )}
      <video
        ref={videoRef}
        muted
        playsInline
        aria-label="Camera view"
        className={active ? 'order-last w-full max-w-md basis-full rounded-lg border-2 border-graphite-700 bg-graphite-950' : 'hidden'}
      />
      {problem ? <p className="order-last basis-full text-lg text-fail-ink">{problem}</p> : null}
    </div>
  );
}
