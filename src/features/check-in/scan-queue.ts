import type { ScanBody } from '@domain/contracts/tour.ts';

/**
 * Scans waiting to be sent: kept in IndexedDB on the phone (photos are Blobs, too big for localStorage),
 * so a scan made without a connection survives a reload and is sent when the connection returns. Each
 * carries its own idempotency key, so sending one twice (the answer was lost) stores it once.
 * Where IndexedDB is missing (old browsers, tests) the queue lives in memory for the page's life.
 */
export interface QueuedScan {
  key: string;
  productionId: string;
  engagementId: string;
  body: ScanBody;
  /** The crate, when known on the phone (ticked, or read from the QR code), for the counts shown at once. */
  crateId: string | null;
  photo?: Blob;
  photoName?: string;
  /** Set once the scan is stored and only the photo is still to go. */
  scanId?: string;
  queuedAt: string;
  lastError?: string;
}

const DB_NAME = 'ballast-check-in';
const STORE = 'scans';
const memory = new Map<string, QueuedScan>();
const listeners = new Set<() => void>();

function openDb(): Promise<IDBDatabase | null> {
  if (typeof indexedDB === 'undefined') return Promise.resolve(null);
  return new Promise((resolve) => {
    const req = indexedDB.open(DB_NAME, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE, { keyPath: 'key' });
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => resolve(null);
  });
}

async function withStore<T>(mode: IDBTransactionMode, run: (s: IDBObjectStore) => IDBRequest<T>): Promise<T | undefined> {
  const db = await openDb();
  if (!db) return undefined;
  return new Promise((resolve, reject) => {
    const tx = db.transaction(STORE, mode);
    const req = run(tx.objectStore(STORE));
    tx.oncomplete = () => {
      db.close();
      resolve(req.result);
    };
    tx.onerror = () => {
      db.close();
      reject(tx.error);
    };
  });
}

function changed() {
  for (const l of listeners) l();
}

export function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export async function enqueue(item: QueuedScan): Promise<void> {
  memory.set(item.key, item);
  try {
    await withStore('readwrite', (s) => s.put(item));
  } catch {
    // Private browsing may refuse storage: the scan stays in memory for this page.
  }
  changed();
}

export async function update(item: QueuedScan): Promise<void> {
  await enqueue(item);
}

export async function remove(key: string): Promise<void> {
  memory.delete(key);
  try {
    await withStore('readwrite', (s) => s.delete(key));
  } catch {
    // see enqueue
  }
  changed();
}

/** Every queued scan of an engagement, oldest first (from storage, and any held only in memory). */
export async function pending(engagementId: string): Promise<QueuedScan[]> {
  let stored: QueuedScan[];
  try {
    stored = ((await withStore('readonly', (s) => s.getAll())) as QueuedScan[] | undefined) ?? [];
  } catch {
    stored = [];
  }
  for (const s of stored) if (!memory.has(s.key)) memory.set(s.key, s);
  return [...memory.values()].filter((s) => s.engagementId === engagementId).sort((a, b) => a.queuedAt.localeCompare(b.queuedAt));
}

/** A new idempotency key for one scan. */
export function newScanKey(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto ? `scan-${crypto.randomUUID()}` : `scan-${Date.now()}-${Math.random().toString(36).slice(2)}`;
}
