import { Router } from 'express';
import { Op, UniqueConstraintError, type Sequelize } from 'sequelize';
import { z } from 'zod';
import { ConfigVersion, MeterRun, Site } from '../../models';
import { requireCapability } from '../../auth/passport';
import { recordAuditEvent } from '../../audit';
import { badRequest, conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { configVersionSchema, meterRunSchema } from '../../../shared/schemas/setup';
import { presentConfigVersion, presentMeterRun } from './presenter';

/** Before this, a meter run created without an effective date has no history to compute. */
const beginningOfHistory = new Date('2000-01-01T00:00:00Z');

export interface MeterRunHooks {
  /** A configuration version took effect at `from`: hours from then on must be recomputed. */
  configChanged(meterRunId: string, from: Date): Promise<void>;
}

const idParam = (id: string) => (/^\d+$/.test(id) ? id : null);

export async function currentConfig(meterRunId: string, at = new Date()) {
  return ConfigVersion.findOne({
    where: { meterRunId, effectiveFrom: { [Op.lte]: at } },
    order: [['effectiveFrom', 'DESC']],
  });
}

export function meterRunsRouter(sequelize: Sequelize, hooks: MeterRunHooks) {
  const router = Router();

  router.get('/', requireCapability('view'), async (req, res) => {
    const q = validate(z.object({ siteId: z.string().regex(/^\d+$/).optional() }), req.query, 'query');
    const runs = await MeterRun.findAll({ where: q.siteId ? { siteId: q.siteId } : {}, order: [['tag', 'ASC']] });
    // The configuration in force now, for every meter run in one query (newest first per run).
    const versions = await ConfigVersion.findAll({
      where: { meterRunId: runs.map((m) => m.id), effectiveFrom: { [Op.lte]: new Date() } },
      order: [['effectiveFrom', 'DESC']],
    });
    const current = new Map<string, ConfigVersion>();
    for (const v of versions) if (!current.has(String(v.meterRunId))) current.set(String(v.meterRunId), v);
    res.json(runs.map((m) => presentMeterRun(m, current.get(String(m.id)))));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const id = idParam(String(req.params.id));
    const run = id ? await MeterRun.findByPk(id) : null;
    if (!run) throw notFound('Meter run');
    res.json(presentMeterRun(run, await currentConfig(String(run.id))));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(meterRunSchema, req.body);
    if (!(await Site.findByPk(input.siteId)))
      throw badRequest(`siteId: no site ${input.siteId}`, 'siteId', 'invalid_field');
    try {
      const { run, config } = await sequelize.transaction(async (transaction) => {
        const created = await MeterRun.create(
          {
            siteId: input.siteId,
            tag: input.tag,
            name: input.name,
            holdLimitS: input.holdLimitS,
            maxGapS: input.maxGapS,
            stackSwitchUpShare: input.stackSwitchUpShare,
            stackSwitchDownShare: input.stackSwitchDownShare,
            line: input.line,
          },
          { transaction },
        );
        const first = await ConfigVersion.create(
          {
            meterRunId: created.id,
            effectiveFrom: input.effectiveFrom ? new Date(input.effectiveFrom) : beginningOfHistory,
            element: input.element,
            fluid: input.fluid,
            reason: 'first configuration',
            createdBy: req.user!.id,
          },
          { transaction },
        );
        await recordAuditEvent(
          {
            actor: req.user!,
            action: 'meter-run.create',
            entityType: 'meter-run',
            entityId: String(created.id),
            after: presentMeterRun(created, first),
          },
          transaction,
        );
        return { run: created, config: first };
      });
      res.status(201).json(presentMeterRun(run, config));
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw conflict(`A meter run tagged ${input.tag} already exists.`, 'tag', 'duplicate');
      throw err;
    }
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const patch = validate(
      z
        .object({
          name: z.string().trim().min(1).max(200).optional(),
          holdLimitS: z.number().positive().optional(),
          maxGapS: z.number().positive().optional(),
          line: meterRunSchema.shape.line.optional(),
        })
        .strict(),
      req.body,
    );
    const id = idParam(String(req.params.id));
    const updated = await sequelize.transaction(async (transaction) => {
      const run = id ? await MeterRun.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE }) : null;
      if (!run) throw notFound('Meter run');
      const before = presentMeterRun(run);
      await run.update(patch, { transaction });
      await recordAuditEvent(
        {
          actor: req.user!,
          action: 'meter-run.update',
          entityType: 'meter-run',
          entityId: String(run.id),
          before,
          after: presentMeterRun(run),
        },
        transaction,
      );
      return run;
    });
    if (patch.holdLimitS !== undefined || patch.maxGapS !== undefined)
      await hooks.configChanged(String(updated.id), beginningOfHistory);
    res.json(presentMeterRun(updated, await currentConfig(String(updated.id))));
  });

  router.get('/:id/config-versions', requireCapability('view'), async (req, res) => {
    const id = idParam(String(req.params.id));
    if (!id || !(await MeterRun.findByPk(id))) throw notFound('Meter run');
    const versions = await ConfigVersion.findAll({ where: { meterRunId: id }, order: [['effectiveFrom', 'ASC']] });
    res.json(versions.map(presentConfigVersion));
  });

  router.post('/:id/config-versions', requireCapability('configure'), async (req, res) => {
    const input = validate(configVersionSchema, req.body);
    const id = idParam(String(req.params.id));
    const run = id ? await MeterRun.findByPk(id) : null;
    if (!run) throw notFound('Meter run');
    const effectiveFrom = new Date(input.effectiveFrom);
    try {
      const version = await sequelize.transaction(async (transaction) => {
        const created = await ConfigVersion.create(
          {
            meterRunId: run.id,
            effectiveFrom,
            element: input.element,
            fluid: input.fluid,
            reason: input.reason,
            createdBy: req.user!.id,
          },
          { transaction },
        );
        await recordAuditEvent(
          {
            actor: req.user!,
            action: 'config-version.create',
            entityType: 'meter-run',
            entityId: String(run.id),
            after: presentConfigVersion(created),
          },
          transaction,
        );
        return created;
      });
      await hooks.configChanged(String(run.id), effectiveFrom);
      res.status(201).json(presentConfigVersion(version));
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw conflict(
          'A configuration version with this effective time already exists.',
          'effectiveFrom',
          'duplicate',
        );
      throw err;
    }
  });

  return router;
}
