import { acceptInvitationBody } from '../../../src/domain/contracts/auth.ts';
import { PUBLIC, route, type RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';
import { usersRepository, toSessionUser } from '../auth/users.repository.ts';
import { invitationsService } from './invitations.service.ts';

export function invitationRoutes(deps: AppDeps): RouteDef[] {
  const service = invitationsService({ db: deps.db, mailer: deps.mailer, appUrl: deps.config.APP_URL, log: deps.log });
  const users = usersRepository(deps.db);
  return [
    route({ method: 'get', path: '/:token', access: PUBLIC, handler: (req) => service.peek(String(req.params.token)) }),
    route({
      method: 'post',
      path: '/:token/accept',
      access: PUBLIC,
      body: acceptInvitationBody,
      async handler(req) {
        const userId = await service.accept(String(req.params.token), req.body.name, req.body.password);
        const user = (await users.findById(userId))!;
        await new Promise<void>((resolve, reject) => req.logIn({ id: userId }, (err) => (err ? reject(err) : resolve())));
        return { user: toSessionUser(user, await users.memberships(userId)), csrfToken: deps.csrf.generateToken(req, true) };
      },
    }),
  ];
}
