import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { usersRepository, toActor, type UserRow } from './users.repository.ts';
import { authService } from './auth.service.ts';
import type { Mailer } from '../../mail/mailer.ts';
import type { Logger } from 'pino';

interface SessionUserRef {
  id: string;
}

/**
 * passport-local checks e-mail and password; the session stores only the user id. One Passport
 * instance per app (not the module's global), so that several apps in one process stay apart.
 */
export function createPassport(deps: { db: Knex; mailer: Mailer; appUrl: string; log: Logger }): InstanceType<typeof Passport> {
  const passport = new Passport();
  const service = authService(deps);
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: false }, (email, password, done) => {
      service.verifyCredentials(email, password).then(
        (user) => done(null, user ?? false),
        (err) => done(err),
      );
    }),
  );
  passport.serializeUser((user, done) => done(null, { id: (user as UserRow).id } satisfies SessionUserRef));
  // The actor is loaded fresh on every request (below), so role changes apply at once.
  passport.deserializeUser((ref: SessionUserRef, done) => done(null, ref));
  return passport;
}

/** Loads the signed-in person and their memberships into req.actor. */
export function loadActor(db: Knex): RequestHandler {
  const users = usersRepository(db);
  return async (req, _res, next) => {
    try {
      const ref = req.user as SessionUserRef | undefined;
      if (ref?.id) {
        const found = await users.findWithMemberships(ref.id);
        if (found?.user.active) {
          req.actor = toActor(found.user, found.memberships);
          req.units = found.user.units;
        }
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}
