import { Router, type Response } from 'express';
import type { Pool } from 'pg';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { monthlyVolumesRepository } from '../monthly-volumes/repository';
import { balanceGroupsRepository } from '../balance-groups/repository';
import { monthlyStatementQuery, monthlyVolumesExportQuery } from './schema';
import { exportMonthlyVolumes, monthlyStatement, type ExportFile } from './use-cases';

const send = (res: Response, file: ExportFile, disposition: 'attachment' | 'inline') => {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `${disposition}; filename="${file.fileName}"`);
  res.send(file.body);
};

/**
 * Exports of the month (engineer, accountant, admin): `GET /api/exports/monthly-volumes?month&siteId&format=csv|xlsx`
 * and the printable `GET /api/exports/monthly-statement?month&siteId&format=html`, with the allocation rows of
 * the site's balance groups. Each is audited.
 */
export function exportsRouter(pool: Pool, sequelize: Sequelize) {
  const router = Router();
  const deps = { volumes: monthlyVolumesRepository(pool), balanceGroups: balanceGroupsRepository(sequelize) };

  router.get('/monthly-volumes', requireCapability('exportVolumes'), async (req, res) => {
    const query = validate(monthlyVolumesExportQuery, req.query, 'query');
    send(res, await exportMonthlyVolumes(deps, { ...query, actor: req.user! }), 'attachment');
  });

  router.get('/monthly-statement', requireCapability('exportVolumes'), async (req, res) => {
    const query = validate(monthlyStatementQuery, req.query, 'query');
    send(res, await monthlyStatement(deps, { ...query, actor: req.user! }), 'inline');
  });

  return router;
}
