import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Store, type SessionData } from 'express-session';
import { throttleTouch } from '../../server/modules/auth/session-touch.ts';
import { createTestApp, type TestApp } from './helpers.ts';

/** A store that only counts what reaches it; `fail` makes the next touch fail. */
class CountingStore extends Store {
  touches = 0;
  sets = 0;
  destroys = 0;
  fail = false;
  get(_sid: string, cb: (err: unknown, session?: SessionData | null) => void) {
    cb(null, null);
  }
  set(_sid: string, _s: SessionData, cb?: (err?: unknown) => void) {
    this.sets++;
    cb?.();
  }
  destroy(_sid: string, cb?: (err?: unknown) => void) {
    this.destroys++;
    cb?.();
  }
  override touch(_sid: string, _s: SessionData, cb?: (err?: unknown) => void) {
    this.touches++;
    const err = this.fail ? new Error('database down') : undefined;
    this.fail = false;
    (cb as ((e?: unknown) => void) | undefined)?.(err);
  }
}

const sess = {} as SessionData;
const call = (fn: (done: (err?: unknown) => void) => void) => new Promise<unknown>((resolve) => fn((err) => resolve(err)));

describe('throttleTouch', () => {
  it('writes a session expiry at most once per interval, and again once it has passed', async () => {
    let clock = 1_000_000;
    const inner = new CountingStore();
    const store = throttleTouch(inner, 60_000, () => clock);
    await call((d) => store.touch!('a', sess, d));
    await call((d) => store.touch!('a', sess, d));
    clock += 59_999;
    await call((d) => store.touch!('a', sess, d));
    expect(inner.touches).toBe(1);
    clock += 1;
    await call((d) => store.touch!('a', sess, d));
    expect(inner.touches).toBe(2);
    // Another session is not held back by the first.
    await call((d) => store.touch!('b', sess, d));
    expect(inner.touches).toBe(3);
  });

  it('counts a save as a touch, retries a failed touch, and forgets a destroyed session', async () => {
    let clock = 0;
    const inner = new CountingStore();
    const store = throttleTouch(inner, 60_000, () => clock);
    await call((d) => store.set('a', sess, d));
    await call((d) => store.touch!('a', sess, d));
    expect([inner.sets, inner.touches]).toEqual([1, 0]);

    clock += 60_000;
    inner.fail = true;
    expect(await call((d) => store.touch!('a', sess, d))).toBeInstanceOf(Error);
    await call((d) => store.touch!('a', sess, d));
    expect(inner.touches).toBe(2);

    await call((d) => store.destroy('a', d));
    await call((d) => store.touch!('a', sess, d));
    expect([inner.destroys, inner.touches]).toEqual([1, 3]);
  });
});

describe('sessions in the app', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  const sidOf = (res: { headers: Record<string, unknown> }) => {
    const cookie = String(res.headers['set-cookie'] ?? '');
    const m = /ballast\.sid=s%3A([^.;]+)\./.exec(cookie);
    return m?.[1];
  };

  it('does not rewrite the stored session on every request, and sign-out still ends it', async () => {
    const agent = await t.anonymous();
    const signIn = await agent.post('/api/auth/sign-in').set('x-csrf-token', agent.csrf).send({ email: 'rigger@ballast.example', password: 'demo-rigger-2027' }).expect(200);
    const sid = sidOf(signIn);
    expect(sid).toBeTruthy();
    const expireOf = async () => (await t.db('session').where({ sid }).first('expire'))?.expire as Date | undefined;
    const before = await expireOf();
    expect(before).toBeInstanceOf(Date);

    await new Promise((r) => setTimeout(r, 1100));
    for (let i = 0; i < 3; i++) await agent.get('/api/auth/me').expect(200);
    // Within the minute after the sign-in saved it, no request moved the stored expiry.
    expect((await expireOf())!.getTime()).toBe(before!.getTime());

    await agent.post('/api/auth/sign-out').set('x-csrf-token', signIn.body.csrfToken).expect(204);
    expect(await expireOf()).toBeUndefined();
    await agent.get('/api/auth/me').expect(401);
  });
});
