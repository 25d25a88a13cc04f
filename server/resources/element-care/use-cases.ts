import type { Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import type { CertificateUpload, StoredCertificate } from '../../certificates/store';
import { badRequest, notFound } from '../../errors';
import { configDifference, type JsonValue } from '../../../shared/config/config-difference';
import { elementSpecSchema, fluidSpecSchema } from '../../../shared/schemas/flow-case';
import type { ConfigVersionRecord } from '../meter-runs/repository';
import {
  addConfigVersion,
  type ConfigVersionEntry,
  type MeterRunDeps,
  type RecomputeSummary,
} from '../meter-runs/use-cases';
import { parseCalibrationCsv } from './calibration-csv';
import { analysedComposition } from './gas-composition';
import type {
  ElementCalibrationRecord,
  ElementCareRepository,
  GasAnalysisRecord,
  InspectionRecord,
} from './repository';
import type { ElementCalibrationInput, GasAnalysisInput, InspectionInput, InspectionKind } from './schema';
import { presentCalibration, presentGasAnalysis, presentInspection } from './presenter';

export interface ElementCareDeps {
  sequelize: Sequelize;
  repository: ElementCareRepository;
  /** The meter runs' own dependencies: every change of figures goes through their addConfigVersion. */
  meterRuns: MeterRunDeps;
}

/** A record with the configuration version it made (null: it changed nothing). */
export interface Recorded<T> {
  record: T;
  configVersion: (ConfigVersionEntry & { recompute: RecomputeSummary }) | null;
}

type Element = ReturnType<typeof elementSpecSchema.parse>;
type Fluid = ReturnType<typeof fluidSpecSchema.parse>;

/**
 * Parses an element or fluid built here from stored JSON and a record's numbers; an issue
 * becomes a 400 naming `prefix.field`, the field of the request that caused it.
 */
function checked<S extends typeof elementSpecSchema | typeof fluidSpecSchema>(
  schema: S,
  value: unknown,
  prefix: string,
): ReturnType<S['parse']> {
  const result = schema.safeParse(value);
  if (result.success) return result.data as ReturnType<S['parse']>;
  const issue = result.error.issues[0];
  const field = [prefix, ...issue.path].join('.');
  throw badRequest(`${field}: ${issue.message}`, field, 'invalid_field');
}

/**
 * The configuration in force at `at`, which a record dated then changes.
 * @throws not found for no meter run; bad request naming `field` before its history starts
 */
async function configInForce({ repository }: MeterRunDeps, meterRunId: string, at: Date, field: string) {
  if (!(await repository.findById(meterRunId))) throw notFound('Meter run');
  const config = await repository.currentConfig(meterRunId, at);
  if (!config)
    throw badRequest(
      `${field}: the meter run has no configuration in force at ${at.toISOString()} (before its history starts)`,
      field,
      'invalid_field',
    );
  return config;
}

/** Adds the version through the meter runs' own use case (closed months, audit, recompute). */
function newVersion(
  deps: ElementCareDeps,
  meterRunId: string,
  at: Date,
  config: { element: Element; fluid: Fluid; reverseElement?: Element; directionSource?: DirectionSource },
  reason: string,
  actor: SignedInUser,
) {
  return addConfigVersion(deps.meterRuns, {
    meterRunId,
    input: {
      effectiveFrom: at.toISOString(),
      element: config.element,
      fluid: config.fluid,
      // A bi-directional run stays bi-directional: the new version keeps the reverse constants in force.
      ...(config.reverseElement
        ? { reverseElement: config.reverseElement, directionSource: config.directionSource ?? 'dp-sign' }
        : {}),
      reason,
    },
    actor,
  });
}

type DirectionSource = 'dp-sign' | 'direction-input';

/** The reverse constants in force (issue 13 §11), carried into a version the element's care makes. */
const reverseOf = (c: ConfigVersionRecord): { reverseElement?: Element; directionSource?: DirectionSource } =>
  c.reverseElement
    ? {
        reverseElement: checked(elementSpecSchema, c.reverseElement, 'reverseElement'),
        directionSource: c.directionSource ?? 'dp-sign',
      }
    : {};

/**
 * Refuses a next due date before the record's own date, both as dates in the site's zone.
 * @throws bad request naming `nextDue`
 */
async function checkNextDue({ repository }: MeterRunDeps, meterRunId: string, at: Date, nextDue: string | undefined) {
  if (nextDue === undefined) return;
  const meterRun = await repository.findById(meterRunId);
  const timeZone = (meterRun && (await repository.siteTimeZone(meterRun.siteId))) ?? 'UTC';
  // en-CA writes a date as YYYY-MM-DD, so the two compare as strings.
  const day = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(
    at,
  );
  if (nextDue < day)
    throw badRequest(
      `nextDue: ${nextDue} is before the record's date ${day} (${timeZone})`,
      'nextDue',
      'invalid_field',
    );
}

/** A kept certificate as the record stores it. */
const certificateFile = (c: StoredCertificate | null) =>
  c
    ? { path: c.path, sha256: c.sha256, contentType: c.contentType, sizeBytes: c.sizeBytes, fileName: c.originalName }
    : null;

/**
 * The checks every record makes before it writes anything: the next due date against the
 * record's date, then the certificate's type by content (a refused file leaves no version behind).
 */
async function checkRecord(
  deps: ElementCareDeps,
  meterRunId: string,
  at: Date,
  nextDue: string | undefined,
  certificate: CertificateUpload | null,
) {
  await checkNextDue(deps.meterRuns, meterRunId, at, nextDue);
  if (certificate) await certificate.check();
}

const storedFluid = (c: ConfigVersionRecord) => checked(fluidSpecSchema, c.fluid, 'fluid');

/**
 * Records a laboratory calibration of the primary element (issue 11 §2): its C-vs-Re_D points
 * (as points or CSV) and the certificate's U(C) become a configuration version from
 * `effectiveFrom` (default the calibration time): the curve replaces any fixed C, and the hourly
 * records recompute with the certificate's uncertainty and flag hours outside its Re_D range.
 * @throws not found; bad request naming the field; conflict for a closed month or a taken instant
 */
export async function recordElementCalibration(
  deps: ElementCareDeps,
  request: {
    meterRunId: string;
    input: ElementCalibrationInput;
    certificate: CertificateUpload | null;
    actor: SignedInUser;
  },
): Promise<Recorded<ElementCalibrationRecord>> {
  const { meterRunId, input, actor } = request;
  const points = [...(input.points ?? parseCalibrationCsv(input.pointsCsv ?? ''))].sort(
    (a, b) => a.reynoldsNumber - b.reynoldsNumber,
  );
  const calibratedAt = new Date(input.calibratedAt);
  const effectiveFrom = input.effectiveFrom ? new Date(input.effectiveFrom) : calibratedAt;
  const current = await configInForce(
    deps.meterRuns,
    meterRunId,
    effectiveFrom,
    input.effectiveFrom ? 'effectiveFrom' : 'calibratedAt',
  );
  await checkRecord(deps, meterRunId, calibratedAt, input.nextDue, request.certificate);
  // A calibration in reverse flow (issue 13 §11) is the curve of the reverse constants: a one-way run has none.
  const reverse = input.direction === 'reverse';
  if (reverse && !current.reverseElement)
    throw badRequest(
      'direction: a reverse calibration needs a bi-directional meter run (the configuration in force has no reverseElement)',
      'direction',
      'invalid_field',
    );
  // A fixed C and a curve exclude each other: the curve replaces it.
  const { dischargeCoefficient: _fixed, ...element } = (reverse ? current.reverseElement : current.element) ?? {};
  const calibrated = checked(
    elementSpecSchema,
    { ...element, calibration: points, calibrationUncertaintyPercent: input.uncertaintyPercent },
    'points',
  );
  const forwardElement = checked(elementSpecSchema, current.element, 'element');
  const version = await newVersion(
    deps,
    meterRunId,
    effectiveFrom,
    reverse
      ? { element: forwardElement, fluid: storedFluid(current), ...reverseOf(current), reverseElement: calibrated }
      : { element: calibrated, fluid: storedFluid(current), ...reverseOf(current) },
    input.reason ?? `element calibration of ${calibratedAt.toISOString().slice(0, 10)} by ${input.laboratory}`,
    actor,
  );
  const record = await deps.sequelize.transaction(async (transaction) => {
    const kept = request.certificate ? await request.certificate.keep() : null;
    const id = await deps.repository.insertCalibration(
      {
        meterRunId,
        calibratedAt,
        effectiveFrom,
        laboratory: input.laboratory,
        certificate: input.certificate ?? null,
        certificateFile: certificateFile(kept),
        nextDue: input.nextDue ?? null,
        uncertaintyPercent: input.uncertaintyPercent,
        points,
        direction: input.direction,
        configVersionId: version.version.id,
        createdBy: actor.id,
      },
      transaction,
    );
    const written = await deps.repository.findCalibration(id, transaction);
    if (!written) throw new Error(`element calibration ${id} vanished after it was written`);
    await recordAuditEvent(
      {
        actor,
        action: 'element-calibration.create',
        entityType: 'meter-run',
        entityId: meterRunId,
        after: presentCalibration(written),
        reason: input.reason ?? null,
      },
      transaction,
    );
    return written;
  });
  return { record, configVersion: version };
}

/**
 * Records a gas analysis (issue 11 §3) and puts its composition in force from the sample time as
 * a configuration version (fluid composition replaced, element unchanged), which recomputes the
 * hours from then on.
 * @throws not found; bad request naming `components…` or `sampledAt`; conflict for a closed month
 *   or a taken instant
 */
export async function recordGasAnalysis(
  deps: ElementCareDeps,
  request: { meterRunId: string; input: GasAnalysisInput; certificate: CertificateUpload | null; actor: SignedInUser },
): Promise<Recorded<GasAnalysisRecord>> {
  const { meterRunId, input, actor } = request;
  const { composition } = analysedComposition(input.components, input.sumTolerance);
  const sampledAt = new Date(input.sampledAt);
  const current = await configInForce(deps.meterRuns, meterRunId, sampledAt, 'sampledAt');
  const fluid = storedFluid(current);
  if (fluid.kind !== 'natural-gas')
    throw badRequest(
      `components: the meter run's fluid is ${fluid.kind}, not natural gas: a gas analysis does not apply`,
      'components',
      'invalid_field',
    );
  await checkRecord(deps, meterRunId, sampledAt, input.nextDue, request.certificate);
  const version = await newVersion(
    deps,
    meterRunId,
    sampledAt,
    {
      element: checked(elementSpecSchema, current.element, 'element'),
      fluid: checked(fluidSpecSchema, { ...fluid, composition }, 'components'),
      ...reverseOf(current),
    },
    input.reason ?? `gas analysis sampled ${sampledAt.toISOString()} by ${input.laboratory}`,
    actor,
  );
  const record = await deps.sequelize.transaction(async (transaction) => {
    const kept = request.certificate ? await request.certificate.keep() : null;
    const id = await deps.repository.insertGasAnalysis(
      {
        meterRunId,
        sampledAt,
        laboratory: input.laboratory,
        certificate: input.certificate ?? null,
        certificateFile: certificateFile(kept),
        nextDue: input.nextDue ?? null,
        components: input.components,
        composition,
        sumTolerance: input.sumTolerance,
        configVersionId: version.version.id,
        createdBy: actor.id,
      },
      transaction,
    );
    const written = await deps.repository.findGasAnalysis(id, transaction);
    if (!written) throw new Error(`gas analysis ${id} vanished after it was written`);
    await recordAuditEvent(
      {
        actor,
        action: 'gas-analysis.create',
        entityType: 'meter-run',
        entityId: meterRunId,
        after: presentGasAnalysis(written),
        reason: input.reason ?? null,
      },
      transaction,
    );
    return written;
  });
  return { record, configVersion: version };
}

const elementKindOf: Record<InspectionKind, Element['kind']> = {
  'orifice-plate': 'orifice',
  cone: 'cone',
  venturi: 'venturi',
  nozzle: 'nozzle',
};

/**
 * The element after an inspection: the recorded element change, else the element in force with
 * the measured bore (or cone diameter) where it differs; null when nothing differs.
 * @throws bad request naming `kind`, `element.…` or `measured.…`
 */
export function elementAfterInspection(current: Element, input: InspectionInput): Element | null {
  const kind = elementKindOf[input.kind];
  if (input.element) {
    if (input.element.kind !== kind)
      throw badRequest(
        `element.kind: the inspection is of a ${input.kind}, the element given is a ${input.element.kind}`,
        'element.kind',
        'invalid_field',
      );
    const changes = configDifference(
      current as unknown as Record<string, JsonValue>,
      input.element as unknown as Record<string, JsonValue>,
    );
    return changes.length ? input.element : null;
  }
  if (current.kind !== kind)
    throw badRequest(
      `kind: the element in force is a ${current.kind}, not a ${input.kind} (record an element change with element)`,
      'kind',
      'invalid_field',
    );
  const { boreDiameterM, coneDiameterM } = input.measured;
  if (kind === 'cone' && coneDiameterM !== undefined && coneDiameterM !== current.coneDiameterM)
    return checked(elementSpecSchema, { ...current, coneDiameterM }, 'measured');
  if (kind !== 'cone' && boreDiameterM !== undefined && boreDiameterM !== current.boreDiameterM)
    return checked(elementSpecSchema, { ...current, boreDiameterM }, 'measured');
  return null;
}

/**
 * Records an inspection of the primary element (issue 11 §3). A measured bore that differs from
 * the element in force, or a recorded element change, becomes a configuration version from the
 * inspection time; an inspection that found the element as configured is a record only.
 * @throws not found; bad request naming the field; conflict for a closed month or a taken instant
 */
export async function recordInspection(
  deps: ElementCareDeps,
  request: { meterRunId: string; input: InspectionInput; certificate: CertificateUpload | null; actor: SignedInUser },
): Promise<Recorded<InspectionRecord>> {
  const { meterRunId, input, actor } = request;
  const inspectedAt = new Date(input.inspectedAt);
  const current = await configInForce(deps.meterRuns, meterRunId, inspectedAt, 'inspectedAt');
  const changed = elementAfterInspection(checked(elementSpecSchema, current.element, 'element'), input);
  await checkRecord(deps, meterRunId, inspectedAt, input.nextDue, request.certificate);
  const version = changed
    ? await newVersion(
        deps,
        meterRunId,
        inspectedAt,
        { element: changed, fluid: storedFluid(current), ...reverseOf(current) },
        input.reason ?? `element inspection of ${inspectedAt.toISOString()}: ${input.condition}`,
        actor,
      )
    : null;
  const record = await deps.sequelize.transaction(async (transaction) => {
    const kept = request.certificate ? await request.certificate.keep() : null;
    const id = await deps.repository.insertInspection(
      {
        meterRunId,
        inspectedAt,
        kind: input.kind,
        measured: input.measured,
        condition: input.condition,
        certificate: input.certificate ?? null,
        certificateFile: certificateFile(kept),
        nextDue: input.nextDue ?? null,
        configVersionId: version?.version.id ?? null,
        createdBy: actor.id,
      },
      transaction,
    );
    const written = await deps.repository.findInspection(id, transaction);
    if (!written) throw new Error(`inspection ${id} vanished after it was written`);
    await recordAuditEvent(
      {
        actor,
        action: 'element-inspection.create',
        entityType: 'meter-run',
        entityId: meterRunId,
        after: presentInspection(written),
        reason: input.reason ?? null,
      },
      transaction,
    );
    return written;
  });
  return { record, configVersion: version };
}

/** @throws not found when the meter run does not exist */
async function existing(deps: ElementCareDeps, meterRunId: string) {
  if (!(await deps.meterRuns.repository.findById(meterRunId))) throw notFound('Meter run');
}

export async function listElementCalibrations(deps: ElementCareDeps, meterRunId: string) {
  await existing(deps, meterRunId);
  return deps.repository.listCalibrations(meterRunId);
}

export async function listGasAnalyses(deps: ElementCareDeps, meterRunId: string) {
  await existing(deps, meterRunId);
  return deps.repository.listGasAnalyses(meterRunId);
}

export async function listInspections(deps: ElementCareDeps, meterRunId: string) {
  await existing(deps, meterRunId);
  return deps.repository.listInspections(meterRunId);
}

/** A record's certificate file as stored; 404 naming the record or the certificate when either is missing. */
export async function certificateOfRecord(
  repository: ElementCareRepository,
  kind: 'calibration' | 'analysis' | 'inspection',
  id: string,
) {
  const found =
    kind === 'calibration'
      ? await repository.findCalibration(id)
      : kind === 'analysis'
        ? await repository.findGasAnalysis(id)
        : await repository.findInspection(id);
  const what = { calibration: 'Element calibration', analysis: 'Gas analysis', inspection: 'Inspection' }[kind];
  if (!found?.certificateFile) throw notFound(found ? 'Certificate' : what);
  return found.certificateFile;
}
