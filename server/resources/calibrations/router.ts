import fs from 'node:fs';
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { notFound } from '../../errors';
import { validate } from '../../http/validate';
import { parseId } from '../../http/params';
import { certificateReceiver, sendCertificate, storeCertificate } from '../../certificates/store';
import { calibrationBody, calibrationPayload } from './schema';
import { calibrationRepository } from './repository';
import { certificateOfCalibration, correctionProposal, listCalibrations, recordCalibration } from './use-cases';
import { presentCalibration, presentCorrectionProposal } from './presenter';

export interface CalibrationRouterOptions {
  sequelize: Sequelize;
  /** Where multipart uploads land before they are checked (services.uploadDir). */
  uploadDir: string;
  /** `<data dir>/certificates` */
  certificatesDir: string;
  /** The certificate size limit in bytes (10 MB by default). */
  maxCertificateBytes?: number;
}

/**
 * `GET/POST /api/transmitters/:id/calibrations`: every role that sees the meter run reads the
 * history; engineers and admins record one (JSON, or multipart with a certificate). Mounted at
 * `/transmitters`.
 */
export function transmitterCalibrationsRouter(options: CalibrationRouterOptions) {
  const router = Router();
  const repository = calibrationRepository(options.sequelize);
  const receive = certificateReceiver({ uploadDir: options.uploadDir, maxBytes: options.maxCertificateBytes });

  router.get('/:id/calibrations', requireCapability('view'), async (req, res) => {
    const calibrations = await listCalibrations(repository, parseId(req.params.id, 'Transmitter'));
    res.json(calibrations.map(presentCalibration));
  });

  router.post('/:id/calibrations', requireCapability('configure'), async (req, res) => {
    const transmitterId = parseId(req.params.id, 'Transmitter');
    const upload = await receive(req, res);
    try {
      const input = validate(calibrationBody, calibrationPayload(req.body, Boolean(req.is('multipart/form-data'))));
      const keepCertificate = upload ? () => storeCertificate(options.certificatesDir, upload) : null;
      const calibration = await recordCalibration(
        { sequelize: options.sequelize, repository },
        { transmitterId, input, keepCertificate, actor: req.user! },
      );
      res.status(201).json(presentCalibration(calibration));
    } finally {
      // A refused request keeps nothing of its upload (a kept certificate was copied into the store).
      if (upload) await fs.promises.rm(upload.file, { force: true });
    }
  });

  return router;
}

/**
 * `GET /api/calibrations/:id/certificate`: the certificate as uploaded, for every signed-in role
 * that sees the meter run (every role sees every meter run); never to a signed-out request.
 * `GET /api/calibrations/:id/correction-proposal` (engineer, admin): the correction a failed
 * as-found suggests.
 * Mounted at `/calibrations`.
 */
export function calibrationCertificatesRouter(options: CalibrationRouterOptions) {
  const router = Router();
  const repository = calibrationRepository(options.sequelize);

  router.get('/:id/certificate', requireCapability('view'), async (req, res) => {
    const certificate = await certificateOfCalibration(repository, parseId(req.params.id, 'Calibration'));
    const sent = await sendCertificate(res, options.certificatesDir, {
      path: certificate.path,
      sha256: certificate.sha256,
      contentType: certificate.contentType,
      originalName: certificate.fileName,
    });
    if (!sent) throw notFound('Certificate file');
  });

  // A suggestion only: the engineer submits it as a normal correction proposal (four eyes).
  router.get('/:id/correction-proposal', requireCapability('configure'), async (req, res) => {
    const proposal = await correctionProposal(repository, parseId(req.params.id, 'Calibration'));
    res.json(presentCorrectionProposal(proposal));
  });

  return router;
}
