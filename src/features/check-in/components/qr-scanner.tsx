import { useEffect, useId, useRef, useState } from 'react';
import { Alert, Button } from '../../../components/ui/index.ts';

/**
 * The phone camera reading crate labels, with html5-qrcode (loaded only when the camera opens). The
 * same code read again within a few seconds counts once, so holding the phone over a label does not
 * check the crate in ten times.
 */
export function QrScanner({ onCode, onClose }: { onCode: (text: string) => void; onClose: () => void }) {
  const id = `qr-${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
  const [error, setError] = useState<string | null>(null);
  const last = useRef<{ text: string; at: number } | null>(null);
  const onCodeRef = useRef(onCode);
  useEffect(() => {
    onCodeRef.current = onCode;
  }, [onCode]);

  useEffect(() => {
    let stopped = false;
    let scanner: { stop(): Promise<void>; isScanning?: boolean } | null = null;
    import('html5-qrcode')
      .then(({ Html5Qrcode }) => {
        if (stopped) return;
        const s = new Html5Qrcode(id, false);
        scanner = s;
        return s.start(
          { facingMode: 'environment' },
          { fps: 10, qrbox: { width: 240, height: 240 } },
          (text) => {
            const now = Date.now();
            if (last.current && last.current.text === text && now - last.current.at < 3000) return;
            last.current = { text, at: now };
            onCodeRef.current(text);
          },
          () => undefined,
        );
      })
      .catch((e: unknown) => {
        if (!stopped) setError(e instanceof Error ? e.message : String(e));
      });
    return () => {
      stopped = true;
      if (scanner?.isScanning !== false) void scanner?.stop().catch(() => undefined);
    };
  }, [id]);

  return (
    <div className="flex flex-col gap-2">
      <div id={id} className="mx-auto w-full max-w-sm overflow-hidden rounded-panel bg-ink-900" aria-label="Camera view" />
      {error && (
        <Alert tone="caution" title="The camera could not be started">
          {error}. Allow the camera for this site, or tick the crates in the list below.
        </Alert>
      )}
      <Button variant="secondary" onClick={onClose}>
        Close the camera
      </Button>
    </div>
  );
}
