import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { meterRunRepository } from '../meter-runs/repository';
import type { MeterRunHooks } from '../meter-runs/use-cases';
import { elementCalibrationBody, gasAnalysisBody, inspectionBody } from './schema';
import { elementCareRepository } from './repository';
import {
  listElementCalibrations,
  listGasAnalyses,
  listInspections,
  recordElementCalibration,
  recordGasAnalysis,
  recordInspection,
} from './use-cases';
import { presentCalibration, presentGasAnalysis, presentInspection, presentRecorded } from './presenter';

/**
 * The care of a meter run's primary element (issue 11 §2, §3): laboratory calibrations, gas
 * analyses and inspections, each a record that may become a configuration version. `hooks` are
 * the meter runs' own (a new version queues its recompute).
 */
export function elementCareRouter(sequelize: Sequelize, hooks: MeterRunHooks) {
  const router = Router();
  const deps = {
    sequelize,
    repository: elementCareRepository(sequelize),
    meterRuns: { sequelize, repository: meterRunRepository(sequelize), hooks },
  };

  router.get('/:id/element-calibrations', requireCapability('view'), async (req, res) => {
    const records = await listElementCalibrations(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentCalibration));
  });

  router.post('/:id/element-calibrations', requireCapability('configure'), async (req, res) => {
    const input = validate(elementCalibrationBody, req.body);
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await recordElementCalibration(deps, { meterRunId, input, actor: req.user! });
    res.status(201).json(presentRecorded(recorded, presentCalibration));
  });

  router.get('/:id/gas-analyses', requireCapability('view'), async (req, res) => {
    const records = await listGasAnalyses(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentGasAnalysis));
  });

  router.post('/:id/gas-analyses', requireCapability('configure'), async (req, res) => {
    const input = validate(gasAnalysisBody, req.body);
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await recordGasAnalysis(deps, { meterRunId, input, actor: req.user! });
    res.status(201).json(presentRecorded(recorded, presentGasAnalysis));
  });

  router.get('/:id/inspections', requireCapability('view'), async (req, res) => {
    const records = await listInspections(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentInspection));
  });

  router.post('/:id/inspections', requireCapability('configure'), async (req, res) => {
    const input = validate(inspectionBody, req.body);
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await recordInspection(deps, { meterRunId, input, actor: req.user! });
    res.status(201).json(presentRecorded(recorded, presentInspection));
  });

  return router;
}
