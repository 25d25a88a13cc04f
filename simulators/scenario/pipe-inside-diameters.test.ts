import { PIPE_INSIDE_DIAMETER_M } from './pipe-inside-diameters';

describe('PIPE_INSIDE_DIAMETER_M', () => {
  // Expected: fluids 1.0.22 (CalebBell), fluids.piping.nearest_pipe(NPS=…, schedule=…)[1], its
  // ASME B36.10M table [lib], run with /usr/bin/python3.
  it.each([
    ['NPS 2 sch 80', 0.04922],
    ['NPS 3 sch 80', 0.07366],
    ['NPS 4 sch 40', 0.10226],
    ['NPS 8 sch 40', 0.20274],
    ['DN 150 sch 40', 0.15408], // NPS 6
    ['DN 200 sch 40', 0.20274], // NPS 8
    ['DN 300 sch 40', 0.30318], // NPS 12
  ] as const)('gives the ASME B36.10M inside diameter of %s as %f m, as the fluids library does', (size, expectedM) => {
    expect(PIPE_INSIDE_DIAMETER_M[size]).toBeCloseTo(expectedM, 8);
  });

  it('agrees with the inch dimensions of NPS 3 schedule 80: 3.500 in OD less two 0.300 in walls is 2.900 in (ASME B36.10M [mem])', () => {
    expect(PIPE_INSIDE_DIAMETER_M['NPS 3 sch 80']).toBeCloseTo(2.9 * 0.0254, 8);
  });
});
