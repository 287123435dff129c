import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { ApiError } from '../../lib/api.ts';
import { checkQueryOptions, postScan, postScanPhoto } from './api/check-in.ts';
import { enqueue, pending, remove, subscribe, update, type QueuedScan } from './scan-queue.ts';

export interface Refusal {
  key: string;
  message: string;
}

/**
 * Keeps the phone's queued scans of one engagement and sends them: now, when the connection returns,
 * and every few seconds while any wait. A scan the server refuses (another production's label, an
 * unknown crate, a photo over the limit) leaves the queue and is shown with the server's reason; a scan
 * that cannot reach the server stays queued.
 */
export function useScanSync(productionId: string, engagementId: string) {
  const qc = useQueryClient();
  const [queue, setQueue] = useState<QueuedScan[]>([]);
  const [refusals, setRefusals] = useState<Refusal[]>([]);
  const [online, setOnline] = useState(typeof navigator === 'undefined' ? true : navigator.onLine);
  const [sending, setSending] = useState(false);
  const busy = useRef(false);

  const reload = useCallback(async () => setQueue(await pending(engagementId)), [engagementId]);

  const flush = useCallback(async () => {
    if (busy.current) return;
    busy.current = true;
    setSending(true);
    let sentAny = false;
    try {
      for (const item of await pending(engagementId)) {
        try {
          let scanId = item.scanId;
          if (!scanId) {
            const res = await postScan(productionId, engagementId, item.body);
            scanId = res.scan.id;
            sentAny = true;
            if (!res.expected) setRefusals((r) => [...r, { key: `${item.key}-unexpected`, message: `${res.scan.crateCode} is checked in, but it is not on the leg to this venue: tell the planner.` }]);
            if (item.photo) await update({ ...item, scanId });
          }
          if (item.photo) await postScanPhoto(productionId, engagementId, scanId, item.photo, item.photoName ?? 'photo.jpg');
          await remove(item.key);
        } catch (error) {
          if (error instanceof ApiError && error.status >= 400 && error.status < 500 && error.status !== 401 && error.status !== 408 && error.status !== 429) {
            await remove(item.key);
            setRefusals((r) => [...r, { key: item.key, message: error.message }]);
            continue;
          }
          await update({ ...item, lastError: error instanceof Error ? error.message : String(error) });
          break;
        }
      }
    } finally {
      busy.current = false;
      setSending(false);
      await reload();
      if (sentAny) void qc.invalidateQueries({ queryKey: checkQueryOptions(productionId, engagementId).queryKey });
    }
  }, [engagementId, productionId, qc, reload]);

  useEffect(() => {
    void reload().then(() => flush());
    const unsubscribe = subscribe(() => void reload());
    const goOnline = () => {
      setOnline(true);
      void flush();
    };
    const goOffline = () => setOnline(false);
    window.addEventListener('online', goOnline);
    window.addEventListener('offline', goOffline);
    return () => {
      unsubscribe();
      window.removeEventListener('online', goOnline);
      window.removeEventListener('offline', goOffline);
    };
  }, [flush, reload]);

  useEffect(() => {
    if (queue.length === 0) return;
    const timer = window.setInterval(() => void flush(), 10_000);
    return () => window.clearInterval(timer);
  }, [queue.length, flush]);

  const add = useCallback(
    async (item: QueuedScan) => {
      await enqueue(item);
      await reload();
      void flush();
    },
    [flush, reload],
  );

  return { queue, refusals, dismiss: (key: string) => setRefusals((r) => r.filter((x) => x.key !== key)), online, sending, add, flush };
}
