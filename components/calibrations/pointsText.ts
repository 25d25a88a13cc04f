/**
 * Calibration points typed as text, one point per line: the applied value then the indicated
 * value, separated by spaces, a tab, a semicolon or a comma ("25 25.06"). A decimal point, not a
 * comma, marks decimals. Faster on a phone than a grid of small fields.
 */

export type PointsParse =
  { ok: true; points: { appliedValue: number; indicatedValue: number }[] } | { ok: false; message: string };

/** @param text the field's text; blank lines are skipped */
export function parsePoints(text: string): PointsParse {
  const points: { appliedValue: number; indicatedValue: number }[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (!line) continue;
    const parts = line.split(/[\s;,]+/).filter(Boolean);
    const [applied, indicated] = parts.map(Number);
    if (parts.length !== 2 || !Number.isFinite(applied) || !Number.isFinite(indicated))
      return { ok: false, message: `Line ${i + 1}: give the applied and the indicated value, e.g. "25 25.06".` };
    points.push({ appliedValue: applied, indicatedValue: indicated });
  }
  return { ok: true, points };
}
