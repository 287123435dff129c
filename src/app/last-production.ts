/**
 * The production a person last worked in, remembered on this device so the app opens there.
 * Stored per user so a shared tablet at a dock does not mix people up.
 */
const KEY = 'ballast.lastProduction';

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' ? window.localStorage : null;
  } catch (_blocked) {
    // Private modes may refuse storage; remembering is a convenience only.
    return null;
  }
}

export function readLastProduction(userId: string): string | null {
  try {
    const raw = storage()?.getItem(KEY);
    const map = raw ? (JSON.parse(raw) as Record<string, string>) : {};
    return typeof map[userId] === 'string' ? map[userId] : null;
  } catch (_bad) {
    return null;
  }
}

export function rememberLastProduction(userId: string, productionId: string): void {
  const store = storage();
  if (!store) return;
  try {
    const raw = store.getItem(KEY);
    const map = raw ? (JSON.parse(raw) as Record<string, string>) : {};
    map[userId] = productionId;
    store.setItem(KEY, JSON.stringify(map));
  } catch (_full) {
    // Quota or bad JSON: forget rather than fail.
  }
}
