import { parsePoints } from './pointsText';

describe('parsePoints', () => {
  it('reads one applied and one indicated value per line, with any of the separators', () => {
    expect(parsePoints('0 0.02\n25;25.06\n\n50,\t49.97\n')).toEqual({
      ok: true,
      points: [
        { appliedValue: 0, indicatedValue: 0.02 },
        { appliedValue: 25, indicatedValue: 25.06 },
        { appliedValue: 50, indicatedValue: 49.97 },
      ],
    });
  });

  it('names the line that is not two numbers', () => {
    expect(parsePoints('0 0\n25')).toEqual({ ok: false, message: expect.stringMatching(/^Line 2:/) });
    expect(parsePoints('0 0\nx 1')).toEqual({ ok: false, message: expect.stringMatching(/^Line 2:/) });
  });
});
