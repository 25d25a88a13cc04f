import { formatInstant } from '../../../shared/format/time';
import { fromSI } from '../../../shared/units';
import type { MonthlyVolumes, MonthFigures } from '../monthly-volumes/use-cases';
import type { AllocationRow } from './use-cases';

/** The units an export states its figures in, from the site's display units (shared/units codes). */
const exportUnits = {
  si: { mass: 't', volume: 'm3', standardVolume: 'm3', energy: 'GJ', pressure: 'kPa', temperature: 'degC' },
  us: { mass: 'lb', volume: 'ft3', standardVolume: 'Mscf', energy: 'MMBtu', pressure: 'psi', temperature: 'degF' },
} as const;

const unitWords: Record<string, string> = { m3: 'm³', ft3: 'ft³', degC: '°C', degF: '°F', psi: 'psia' };
const word = (unit: string) => unitWords[unit] ?? unit;

export type ExportCell = string | number | null;

/** The header block and the table of a monthly volumes export, in the site's units. */
export interface ExportTable {
  /** Label and value pairs: site, month, base conditions, units, status, exported at and by. */
  header: [string, string][];
  columns: string[];
  rows: ExportCell[][];
}

/**
 * @param volumes the month (SI)
 * @param exported when and by whom
 * @returns the export's header block and one row per meter run, its allocation rows and the site total
 */
export function exportTable(
  volumes: MonthlyVolumes,
  exported: { atMs: number; by: { name: string; email: string } },
  allocation: AllocationRow[],
): ExportTable {
  const { site } = volumes;
  const u = exportUnits[site.displayUnits];
  const header: [string, string][] = [
    ['Site', `${site.code} ${site.name}`],
    ['Month', volumes.month],
    ['Contract day starts', `${String(site.contractHour).padStart(2, '0')}:00 ${site.timeZone}`],
    [
      'Base conditions',
      `${round(fromSI(site.basePressurePa, u.pressure), 6)} ${word(u.pressure)}, ${round(fromSI(site.baseTemperatureK, u.temperature), 6)} ${word(u.temperature)}`,
    ],
    [
      'Units',
      `mass ${word(u.mass)}, volume ${word(u.volume)}, volume at base conditions ${word(u.standardVolume)}, energy ${word(u.energy)}`,
    ],
    ['Status', volumes.totals.status],
    // In the site's local time with its zone named, as every screen and mail says time (issue 14).
    ['Exported at', formatInstant(exported.atMs, site.timeZone, { seconds: true })],
    ['Exported by', `${exported.by.name} <${exported.by.email}>`],
  ];
  // A month with reverse flow (a bi-directional meter run, issue 13 §11) names the figures forward and adds
  // reverse and net (forward − reverse) as columns of their own; a one-way month keeps its columns.
  const bidirectional = volumes.meterRuns.some((r) => r.reverse);
  const forward = (label: string) => (bidirectional ? `Forward ${label.toLowerCase()}` : label);
  const columns = [
    'Meter run',
    'Name',
    `${forward('Mass')} (${word(u.mass)})`,
    `${forward('Volume')} (${word(u.volume)})`,
    `${forward('Volume at base conditions')} (${word(u.standardVolume)})`,
    `${forward('Energy')} (${word(u.energy)})`,
    'Coverage (%)',
    'Flags',
    'Expanded uncertainty k=2 (%)',
    'Status',
    'Corrections in force',
    'Change from previous month (%)',
    'Change from a year earlier (%)',
    'Allocation factor',
    ...(bidirectional
      ? [
          `Reverse mass (${word(u.mass)})`,
          `Reverse volume at base conditions (${word(u.standardVolume)})`,
          `Reverse energy (${word(u.energy)})`,
          `Net mass (${word(u.mass)})`,
          `Net volume at base conditions (${word(u.standardVolume)})`,
          `Net energy (${word(u.energy)})`,
        ]
      : []),
  ];
  const conv = (v: number | null, unit: string) => (v === null ? null : fromSI(v, unit));
  const figures = (f: MonthFigures): ExportCell[] => [
    conv(f.massKg, u.mass),
    conv(f.volumeM3, u.volume),
    conv(f.standardVolumeM3, u.standardVolume),
    conv(f.energyJ, u.energy),
    f.coverage === null ? null : f.coverage * 100,
    f.flags.join(' '),
    f.uncertaintyPercent,
    f.status,
  ];
  /** Reverse and net cells (a bi-directional month only): empty for a meter run without reverse flow. */
  const directions = (
    reverse: { massKg: number; standardVolumeM3: number; energyJ: number | null } | undefined,
    net: { massKg: number; standardVolumeM3: number; energyJ: number | null } | undefined,
  ): ExportCell[] =>
    bidirectional
      ? [
          conv(reverse?.massKg ?? null, u.mass),
          conv(reverse?.standardVolumeM3 ?? null, u.standardVolume),
          conv(reverse?.energyJ ?? null, u.energy),
          conv(net?.massKg ?? null, u.mass),
          conv(net?.standardVolumeM3 ?? null, u.standardVolume),
          conv(net?.energyJ ?? null, u.energy),
        ]
      : [];
  const rows: ExportCell[][] = volumes.meterRuns.map((r) => [
    r.meterRun.tag,
    r.meterRun.name,
    ...figures(r),
    r.correctionsInForce,
    r.changeFromPreviousMonthPercent,
    r.changeFromYearEarlierPercent,
    null,
    ...directions(r.reverse, r.net),
  ]);
  rows.push([
    'Site total',
    site.name,
    ...figures(volumes.totals),
    volumes.totals.correctionsInForce,
    volumes.totals.changeFromPreviousMonthPercent,
    volumes.totals.changeFromYearEarlierPercent,
    null,
    // Forward, reverse and net of the site, each in its own columns (never netted into the forward ones).
    ...directions(volumes.totals.reverse, volumes.totals.net),
  ]);
  for (const a of allocation) {
    rows.push([
      a.meterRunTag,
      `Allocated from ${a.fromTag} (${a.groupName})`,
      null,
      null,
      conv(a.allocatedStandardVolumeM3, u.standardVolume),
      conv(a.allocatedEnergyJ, u.energy),
      null,
      '',
      null,
      'allocation',
      null,
      null,
      null,
      a.factor,
      ...directions(undefined, undefined),
    ]);
  }
  return { header, columns, rows };
}

const round = (v: number, significant: number) => Number(v.toPrecision(significant));

/**
 * A text cell that a spreadsheet would read as a formula (it begins with = + - or @) gets a
 * leading apostrophe (OWASP "CSV injection"); numbers stay numbers.
 */
export function neutralised(cell: ExportCell): ExportCell {
  return typeof cell === 'string' && /^[=+\-@]/.test(cell) ? `'${cell}` : cell;
}
