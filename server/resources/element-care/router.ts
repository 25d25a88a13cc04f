import fs from 'node:fs';
import { Router, type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { notFound } from '../../errors';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { certificateReceiver, certificateUpload, sendCertificate } from '../../certificates/store';
import { jsonFieldPayload } from '../../certificates/multipart';
import { meterRunRepository } from '../meter-runs/repository';
import type { MeterRunHooks } from '../meter-runs/use-cases';
import { elementCalibrationBody, gasAnalysisBody, inspectionBody, payloadFields } from './schema';
import { elementCareRepository } from './repository';
import {
  certificateOfRecord,
  listElementCalibrations,
  listGasAnalyses,
  listInspections,
  recordElementCalibration,
  recordGasAnalysis,
  recordInspection,
} from './use-cases';
import { presentCalibration, presentGasAnalysis, presentInspection, presentRecorded } from './presenter';

export interface ElementCareCertificateOptions {
  /** Where multipart uploads land before they are checked (services.uploadDir). */
  uploadDir: string;
  /** `<data dir>/certificates` */
  certificatesDir: string;
  /** The certificate size limit in bytes (10 MB by default). */
  maxCertificateBytes?: number;
}

/**
 * The care of a meter run's primary element (issue 11 §2, §3): laboratory calibrations, gas
 * analyses and inspections, each a record that may become a configuration version, posted as JSON
 * or as a multipart form (the record as JSON text in its field, the file in `certificate`).
 * `hooks` are the meter runs' own (a new version queues its recompute).
 */
export function elementCareRouter(sequelize: Sequelize, hooks: MeterRunHooks, options: ElementCareCertificateOptions) {
  const router = Router();
  const deps = {
    sequelize,
    repository: elementCareRepository(sequelize),
    meterRuns: { sequelize, repository: meterRunRepository(sequelize), hooks },
  };
  const receive = certificateReceiver({ uploadDir: options.uploadDir, maxBytes: options.maxCertificateBytes });

  /** Receives the form (if any), runs `record` with its body and certificate, and keeps nothing of a refused upload. */
  const withCertificate = async <T>(
    req: Request,
    res: Response,
    field: string,
    record: (body: unknown, certificate: ReturnType<typeof certificateUpload>) => Promise<T>,
  ) => {
    const upload = await receive(req, res);
    try {
      const body = jsonFieldPayload(req.body, Boolean(req.is('multipart/form-data')), field);
      return await record(body, certificateUpload(options.certificatesDir, upload));
    } finally {
      if (upload) await fs.promises.rm(upload.file, { force: true });
    }
  };

  router.get('/:id/element-calibrations', requireCapability('view'), async (req, res) => {
    const records = await listElementCalibrations(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentCalibration));
  });

  router.post('/:id/element-calibrations', requireCapability('configure'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await withCertificate(req, res, payloadFields.calibration, (body, certificate) =>
      recordElementCalibration(deps, {
        meterRunId,
        input: validate(elementCalibrationBody, body),
        certificate,
        actor: req.user!,
      }),
    );
    res.status(201).json(presentRecorded(recorded, presentCalibration));
  });

  router.get('/:id/gas-analyses', requireCapability('view'), async (req, res) => {
    const records = await listGasAnalyses(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentGasAnalysis));
  });

  router.post('/:id/gas-analyses', requireCapability('configure'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await withCertificate(req, res, payloadFields.analysis, (body, certificate) =>
      recordGasAnalysis(deps, { meterRunId, input: validate(gasAnalysisBody, body), certificate, actor: req.user! }),
    );
    res.status(201).json(presentRecorded(recorded, presentGasAnalysis));
  });

  router.get('/:id/inspections', requireCapability('view'), async (req, res) => {
    const records = await listInspections(deps, parseId(req.params.id, 'Meter run'));
    res.json(records.map(presentInspection));
  });

  router.post('/:id/inspections', requireCapability('configure'), async (req, res) => {
    const meterRunId = parseId(req.params.id, 'Meter run');
    const recorded = await withCertificate(req, res, payloadFields.inspection, (body, certificate) =>
      recordInspection(deps, { meterRunId, input: validate(inspectionBody, body), certificate, actor: req.user! }),
    );
    res.status(201).json(presentRecorded(recorded, presentInspection));
  });

  return router;
}

/**
 * `GET /api/element-calibrations/:id/certificate`, `/api/gas-analyses/:id/certificate` and
 * `/api/element-inspections/:id/certificate`: the certificate as uploaded, for every signed-in role
 * (every role sees every meter run); never to a signed-out request. Mounted at the collection.
 */
export function elementCareCertificateRouter(
  sequelize: Sequelize,
  kind: 'calibration' | 'analysis' | 'inspection',
  options: Pick<ElementCareCertificateOptions, 'certificatesDir'>,
) {
  const router = Router();
  const repository = elementCareRepository(sequelize);
  const what = { calibration: 'Element calibration', analysis: 'Gas analysis', inspection: 'Inspection' }[kind];

  router.get('/:id/certificate', requireCapability('view'), async (req, res) => {
    const file = await certificateOfRecord(repository, kind, parseId(req.params.id, what));
    const sent = await sendCertificate(res, options.certificatesDir, {
      path: file.path,
      sha256: file.sha256,
      contentType: file.contentType,
      originalName: file.fileName,
    });
    if (!sent) throw notFound('Certificate file');
  });

  return router;
}
