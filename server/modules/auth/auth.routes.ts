import type { Request, Response } from 'express';
import { changePasswordBody, preferencesBody, resetCompleteBody, resetRequestBody, signInBody, type SignInBody } from '../../../src/domain/contracts/auth.ts';
import { AppError } from '../../http/errors.ts';
import { PUBLIC, SIGNED_IN, route, type RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';
import { usersRepository, toSessionUser, type UserRow } from './users.repository.ts';
import { authService } from './auth.service.ts';

export function authRoutes(deps: AppDeps): RouteDef[] {
  const users = usersRepository(deps.db);
  const service = authService({ db: deps.db, mailer: deps.mailer, appUrl: deps.config.APP_URL, log: deps.log });

  const me = async (userId: string) => {
    const user = await users.findById(userId);
    if (!user) throw new AppError('unauthenticated', 'Sign in to continue.');
    return toSessionUser(user, await users.memberships(userId));
  };

  return [
    route({
      method: 'get',
      path: '/csrf',
      access: PUBLIC,
      handler: (req) => ({ csrfToken: deps.csrf.generateToken(req) }),
    }),
    route({
      method: 'post',
      path: '/sign-in',
      access: PUBLIC,
      body: signInBody,
      async handler(req, res) {
        const { email } = req.body as SignInBody;
        const address = req.ip ?? 'unknown';
        await deps.signInLimiter.check(email, address);
        const user = await authenticate(deps, req, res);
        if (!user) {
          await deps.signInLimiter.recordFailure(email, address);
          throw new AppError('unauthenticated', 'That e-mail and password do not match an active account.', { code: 'invalid_credentials' });
        }
        await deps.signInLimiter.recordSuccess(email);
        // passport regenerates the session on log-in (no session fixation); the new session
        // needs a new CSRF token, which goes back with the answer.
        await new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
        return { user: await me(user.id), csrfToken: deps.csrf.generateToken(req, true) };
      },
    }),
    route({
      method: 'post',
      path: '/sign-out',
      access: SIGNED_IN,
      async handler(req, res) {
        await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
        await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
        res.clearCookie(deps.sessionCookieName);
        res.status(204).end();
      },
    }),
    route({ method: 'get', path: '/me', access: SIGNED_IN, handler: async (req) => ({ user: await me(req.actor!.userId) }) }),
    route({
      method: 'patch',
      path: '/me/preferences',
      access: SIGNED_IN,
      body: preferencesBody,
      async handler(req) {
        await users.setUnits(req.actor!.userId, req.body.units);
        return { user: await me(req.actor!.userId) };
      },
    }),
    route({
      method: 'post',
      path: '/me/password',
      access: SIGNED_IN,
      body: changePasswordBody,
      handler: (req) => service.changePassword(req.actor!.userId, req.body.currentPassword, req.body.newPassword),
    }),
    route({
      method: 'post',
      path: '/password-reset/request',
      access: PUBLIC,
      body: resetRequestBody,
      async handler(req, res) {
        await service.requestReset(req.body.email);
        res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
      },
    }),
    route({
      method: 'post',
      path: '/password-reset/complete',
      access: PUBLIC,
      body: resetCompleteBody,
      handler: (req) => service.completeReset(req.body.token, req.body.password),
    }),
  ];
}

function authenticate(deps: AppDeps, req: Request, res: Response): Promise<UserRow | undefined> {
  return new Promise((resolve, reject) => {
    deps.passport.authenticate('local', { session: false }, (err: unknown, user: UserRow | false) => {
      if (err) reject(err);
      else resolve(user || undefined);
    })(req, res, () => undefined);
  });
}
