import type { Store } from 'express-session';

/**
 * express-session "touches" the stored session on every request that leaves it unchanged, to push its
 * expiry forward, and holds the answer back until that UPDATE has been committed (a durable commit, so a
 * disk flush). Sessions last 12 hours from the last request; a minute of slack in the stored expiry changes
 * nothing a person could notice, so each app server writes a session's new expiry at most once per
 * `intervalMs` and answers at once in between. Saves (set) count as touches; a destroyed session is
 * forgotten. Worst case: a session idle for 12 hours ends up to `intervalMs` earlier than its cookie says.
 *
 * The load benchmark (scripts/bench/load.ts) showed the touch as one of the few database round trips every
 * signed-in request pays.
 */
export function throttleTouch<S extends Store>(store: S, intervalMs: number, now: () => number = Date.now): S {
  if (!store.touch) return store;
  // The typings give these callbacks no argument; stores pass the error, if any.
  type Done = (err?: unknown) => void;
  const touch = store.touch.bind(store) as (sid: string, session: unknown, done: Done) => void;
  const set = store.set.bind(store) as (sid: string, session: unknown, done: Done) => void;
  const destroy = store.destroy.bind(store);
  const last = new Map<string, number>();
  const remember = (sid: string) => {
    const t = now();
    if (last.size >= 10_000) for (const [s, at] of last) if (t - at >= intervalMs) last.delete(s);
    last.set(sid, t);
  };

  store.touch = (sid, session, callback?: Done) => {
    const at = last.get(sid);
    if (at !== undefined && now() - at < intervalMs) {
      callback?.();
      return;
    }
    remember(sid);
    touch(sid, session, (err) => {
      // A touch that failed is tried again by the next request.
      if (err) last.delete(sid);
      callback?.(err);
    });
  };
  store.set = (sid, session, callback?: Done) => {
    set(sid, session, (err) => {
      if (err) last.delete(sid);
      else remember(sid);
      callback?.(err);
    });
  };
  store.destroy = (sid, callback) => {
    last.delete(sid);
    destroy(sid, callback);
  };
  return store;
}
