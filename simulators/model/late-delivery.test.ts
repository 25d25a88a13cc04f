import { lateReleaseMs } from './late-delivery';

describe('lateReleaseMs', () => {
  it('holds a KFG-103 reading of minute 41 until minute 48 of the same hour', () => {
    expect(lateReleaseMs('KFG-103-DP', Date.parse('2026-12-02T10:41:30Z'))).toBe(Date.parse('2026-12-02T10:48:00Z'));
    expect(lateReleaseMs('KFG-103-TT', Date.parse('2026-12-02T10:40:00Z'))).toBe(Date.parse('2026-12-02T10:48:00Z'));
  });

  it('sends KFG-103 readings outside minutes 40–45 at once', () => {
    expect(lateReleaseMs('KFG-103-DP', Date.parse('2026-12-02T10:45:00Z'))).toBeNull();
    expect(lateReleaseMs('KFG-103-DP', Date.parse('2026-12-02T10:39:55Z'))).toBeNull();
  });

  it("never holds another meter run's readings", () => {
    expect(lateReleaseMs('KFG-102-DP', Date.parse('2026-12-02T10:41:30Z'))).toBeNull();
    expect(lateReleaseMs('BPM-ST1-DP', Date.parse('2026-12-02T10:41:30Z'))).toBeNull();
  });
});
