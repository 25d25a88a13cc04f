import { badRequest } from '../../errors';
import type { CalibrationPoint } from '../../../shared/flow/flow-types';

const header = ['reynoldsNumber', 'dischargeCoefficient'];

/**
 * The points of a laboratory calibration (C against Re_D) from CSV text: a header line
 * `reynoldsNumber,dischargeCoefficient`, then one point a line (blank lines ignored). Numbers in
 * plain or exponent notation with a decimal point ("1.5e5", "150000", "0.8012").
 * @throws bad request naming `pointsCsv` and the line
 */
export function parseCalibrationCsv(text: string): CalibrationPoint[] {
  const lines = text.split(/\r?\n/);
  const fail = (line: number, why: string) =>
    badRequest(`pointsCsv: line ${line}: ${why}`, 'pointsCsv', 'invalid_field');
  const first = lines.findIndex((l) => l.trim() !== '');
  if (first < 0)
    throw badRequest('pointsCsv: is empty (header reynoldsNumber,dischargeCoefficient)', 'pointsCsv', 'invalid_field');
  const names = lines[first]
    .replace(/^\uFEFF/, '')
    .split(',')
    .map((c) => c.trim());
  if (names.length !== 2 || names[0] !== header[0] || names[1] !== header[1])
    throw fail(first + 1, `the header must be ${header.join(',')} (got ${lines[first].trim()})`);
  const points: CalibrationPoint[] = [];
  for (let i = first + 1; i < lines.length; i++) {
    if (lines[i].trim() === '') continue;
    const cells = lines[i].split(',').map((c) => c.trim());
    if (cells.length !== 2) throw fail(i + 1, `expected 2 fields (Re_D, C), got ${cells.length}`);
    const [re, c] = cells.map((cell) => (/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell) ? Number(cell) : NaN));
    if (!(re > 0)) throw fail(i + 1, `reynoldsNumber must be a number > 0 (got ${cells[0]})`);
    if (!(c > 0 && c <= 1.2)) throw fail(i + 1, `dischargeCoefficient must be a number in (0, 1.2] (got ${cells[1]})`);
    if (points.some((p) => p.reynoldsNumber === re)) throw fail(i + 1, `a second point at Re_D = ${re}`);
    points.push({ reynoldsNumber: re, dischargeCoefficient: c });
  }
  if (points.length === 0) throw fail(first + 2, 'no calibration points after the header');
  return points;
}
