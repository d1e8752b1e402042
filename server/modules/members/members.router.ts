import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { memberRoleChangeSchema } from '#shared/schemas/members';
import { parseBody } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { recordId } from '../records/params';
import { changeRole, listMembers, removeMember } from './members.service';
import { presentMember } from './members.presenter';

export function membersRouter(deps: { sequelize: Sequelize; table: RouteTableEntry[] }) {
  const { sequelize, table } = deps;
  const router = Router();
  const actorOf = (req: Parameters<typeof requireSignedIn>[0]) => {
    const user = requireSignedIn(req);
    return { id: user.id, name: user.name };
  };
  mountRoutes(
    router,
    '/api/gardens/:gardenId/members',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const m = req.membership!;
          res.json({ items: (await listMembers(sequelize, m.gardenId)).map((row) => presentMember(row, m.role)) });
        },
      },
      {
        // Before '/:userId', so "me" is never read as an id.
        method: 'delete',
        path: '/me',
        access: 'viewer',
        handler: async (req, res) => {
          const actor = actorOf(req);
          await removeMember(sequelize, req.membership!.gardenId, actor, actor.id);
          res.status(204).end();
        },
      },
      {
        method: 'patch',
        path: '/:userId',
        access: 'owner',
        handler: async (req, res) => {
          const m = req.membership!;
          const userId = recordId(req.params, 'userId');
          const { role } = parseBody(memberRoleChangeSchema, req.body);
          const member = await changeRole(sequelize, m.gardenId, actorOf(req), userId, role);
          // The actor may have just stepped down: the e-mail follows their role now.
          res.json({ member: presentMember(member, member.userId === req.user!.id ? member.role : m.role) });
        },
      },
      {
        method: 'delete',
        path: '/:userId',
        access: 'owner',
        handler: async (req, res) => {
          await removeMember(sequelize, req.membership!.gardenId, actorOf(req), recordId(req.params, 'userId'));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
