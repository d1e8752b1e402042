import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { auditListQuerySchema } from '#shared/schemas/audit';
import type { AuditPageDto } from '#shared/schemas/audit';
import { mountRoutes } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { parseQuery } from '../../lib/validate';
import { listAudit } from './audit.service';
import { presentAuditEntry } from './audit.presenter';

export function auditRouter(sequelize: Sequelize, table: RouteTableEntry[]) {
  const router = Router();
  mountRoutes(
    router,
    '/api/gardens/:gardenId/audit',
    [
      {
        method: 'get',
        path: '/',
        access: 'owner',
        handler: async (req, res) => {
          const { gardenId, garden } = req.membership!;
          const q = parseQuery(auditListQuerySchema, req.query);
          const { rows, total, actors } = await listAudit(sequelize, gardenId, garden.timeZone, q);
          const body: AuditPageDto = { items: rows.map(presentAuditEntry), page: q.page, pageSize: q.pageSize, total, actors };
          res.json(body);
        },
      },
    ],
    table,
  );
  return router;
}
