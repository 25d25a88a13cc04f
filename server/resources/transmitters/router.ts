import { Router } from 'express';
import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { z } from 'zod';
import { MeterRun, Transmitter } from '../../models';
import { requireCapability } from '../../auth/passport';
import { recordAuditEvent } from '../../audit';
import { badRequest, conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { transmitterSchema } from '../../../shared/schemas/setup';
import { presentTransmitter } from './presenter';

const listQuery = z.object({ meterRunId: z.string().regex(/^\d+$/, 'must be a meter run id').optional() });

export function transmittersRouter(sequelize: Sequelize, hooks: { changed(): void }) {
  const router = Router();

  router.get('/', requireCapability('view'), async (req, res) => {
    const q = validate(listQuery, req.query, 'query');
    const list = await Transmitter.findAll({
      where: q.meterRunId ? { meterRunId: q.meterRunId } : {},
      order: [['tag', 'ASC']],
    });
    res.json(list.map(presentTransmitter));
  });

  router.get('/:id', requireCapability('view'), async (req, res) => {
    const t = /^\d+$/.test(String(req.params.id)) ? await Transmitter.findByPk(String(req.params.id)) : null;
    if (!t) throw notFound('Transmitter');
    res.json(presentTransmitter(t));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const input = validate(transmitterSchema, req.body);
    const meterRun = await MeterRun.findByPk(input.meterRunId);
    if (!meterRun) throw badRequest(`meterRunId: no meter run ${input.meterRunId}`, 'meterRunId', 'invalid_field');
    // A meter run has one DP transmitter, or a stacked pair (one low, one high); one static pressure and one temperature.
    const siblings = await Transmitter.findAll({ where: { meterRunId: input.meterRunId, measures: input.measures } });
    if (input.measures === 'differential-pressure') {
      const clash = siblings.find(
        (s) => s.stackRole === input.stackRole || s.stackRole === 'single' || input.stackRole === 'single',
      );
      if (clash)
        throw conflict(
          `Meter run ${meterRun.tag} already has DP transmitter ${clash.tag} (${clash.stackRole}); it takes one single DP transmitter or one low- and one high-range pair.`,
          'stackRole',
        );
    } else if (siblings.length) {
      throw conflict(
        `Meter run ${meterRun.tag} already has a ${input.measures} transmitter (${siblings[0].tag}).`,
        'measures',
      );
    }
    try {
      const created = await sequelize.transaction(async (transaction) => {
        const t = await Transmitter.create(input, { transaction });
        await recordAuditEvent(
          {
            actor: req.user!,
            action: 'transmitter.create',
            entityType: 'transmitter',
            entityId: String(t.id),
            after: presentTransmitter(t),
          },
          transaction,
        );
        return t;
      });
      hooks.changed();
      res.status(201).json(presentTransmitter(created));
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw conflict(`A transmitter tagged ${input.tag} already exists.`, 'tag', 'duplicate');
      throw err;
    }
  });

  router.patch('/:id', requireCapability('configure'), async (req, res) => {
    const patch = validate(
      z
        .object({
          lowerRange: z.number().optional(),
          upperRange: z.number().optional(),
          accuracyPercentOfSpan: z.number().positive().max(10).optional(),
          calibrationDue: z.iso.date('must be a date YYYY-MM-DD').nullable().optional(),
        })
        .strict(),
      req.body,
    );
    const updated = await sequelize.transaction(async (transaction) => {
      const t = /^\d+$/.test(String(req.params.id))
        ? await Transmitter.findByPk(String(req.params.id), { transaction, lock: transaction.LOCK.UPDATE })
        : null;
      if (!t) throw notFound('Transmitter');
      const before = presentTransmitter(t);
      // Re-validate the whole transmitter so a re-range cannot leave upper below lower, or a unit of the wrong kind.
      validate(transmitterSchema, {
        ...before,
        ...patch,
        calibrationDue: patch.calibrationDue ?? before.calibrationDue ?? undefined,
      });
      await t.update(patch, { transaction });
      await recordAuditEvent(
        {
          actor: req.user!,
          action: 'transmitter.update',
          entityType: 'transmitter',
          entityId: String(t.id),
          before,
          after: presentTransmitter(t),
        },
        transaction,
      );
      return t;
    });
    hooks.changed();
    res.json(presentTransmitter(updated));
  });

  return router;
}
