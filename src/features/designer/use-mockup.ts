import { useCallback, useEffect, useRef, useState } from 'react';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import type { MockupJob, MockupReply, MockupRequest } from './mockup-protocol.ts';

/**
 * The mock-up worker for one photo: loads the photo's preview into it, sends render jobs and
 * keeps the newest picture. `render` may be called on every pointer move; the worker drops
 * stale jobs, and replies to older ids are ignored here.
 */
export function useMockup(photo: { previewUrl: string; previewWidth: number; width: number } | undefined) {
  const worker = useRef<Worker | undefined>(undefined);
  const latest = useRef(0);
  const [ready, setReady] = useState(false);
  const [result, setResult] = useState<{ image: ImageBitmap; ms: number }>();
  const [error, setError] = useState<string>();
  const source = useSteadyValue(photo && { previewUrl: photo.previewUrl, previewWidth: photo.previewWidth, width: photo.width });

  useEffect(() => {
    const w = new Worker(new URL('./mockup.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (event: MessageEvent<MockupReply>) => {
      const reply = event.data;
      if (reply.id !== latest.current) {
        if (reply.type === 'rendered') reply.image.close();
        return;
      }
      if (reply.type === 'failed') return setError(reply.message);
      setError(undefined);
      setResult((old) => {
        old?.image.close();
        return { image: reply.image, ms: reply.ms };
      });
    };
    return () => {
      w.terminate();
      worker.current = undefined;
    };
  }, []);

  useEffect(() => {
    setReady(false);
    if (!source) return;
    let cancelled = false;
    (async () => {
      const response = await fetch(source.previewUrl, { credentials: 'same-origin' });
      if (!response.ok) throw new Error('The photo preview could not be loaded.');
      const bitmap = await createImageBitmap(await response.blob());
      if (cancelled) return bitmap.close();
      const message: MockupRequest = { type: 'photo', bitmap, previewScale: source.previewWidth / source.width };
      worker.current?.postMessage(message, [bitmap]);
      setReady(true);
    })().catch((e: Error) => setError(e.message));
    return () => {
      cancelled = true;
    };
  }, [source]);

  const render = useCallback((job: Omit<MockupJob, 'id'>) => {
    latest.current += 1;
    const message: MockupRequest = { type: 'render', job: { ...job, id: latest.current } };
    worker.current?.postMessage(message);
  }, []);

  return { ready, result, error, render };
}
