/**
 * Inside diameters of the demo meter runs' pipes, from the ASME B36.10M (welded and seamless
 * wrought steel pipe) metric table: inside diameter = outside diameter − 2 × nominal wall [mem].
 * Checked against an outside table in pipe-inside-diameters.test.ts.
 */

/** Inside diameter, m, by nominal size and schedule. */
export const PIPE_INSIDE_DIAMETER_M = Object.freeze({
  /** NPS 2 schedule 80: OD 60.3 mm, wall 5.54 mm [mem]. */
  'NPS 2 sch 80': 0.04922,
  /** NPS 3 schedule 80: OD 88.9 mm, wall 7.62 mm [mem]. */
  'NPS 3 sch 80': 0.07366,
  /** NPS 4 schedule 40: OD 114.3 mm, wall 6.02 mm [mem]. */
  'NPS 4 sch 40': 0.10226,
  /** NPS 8 schedule 40: OD 219.1 mm, wall 8.18 mm [mem]. */
  'NPS 8 sch 40': 0.20274,
  /** DN 150 (NPS 6) schedule 40: OD 168.3 mm, wall 7.11 mm [mem]. */
  'DN 150 sch 40': 0.15408,
  /** DN 200 (NPS 8) schedule 40: OD 219.1 mm, wall 8.18 mm [mem]. */
  'DN 200 sch 40': 0.20274,
  /** DN 300 (NPS 12) schedule 40: OD 323.8 mm, wall 10.31 mm [mem]. */
  'DN 300 sch 40': 0.30318,
});

export type PipeSize = keyof typeof PIPE_INSIDE_DIAMETER_M;
