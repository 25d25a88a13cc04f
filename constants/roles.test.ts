/** The roles and their words: the four roles of shared/DESIGN.md ("Who uses it" and "Roles"). */
import { can, roleLabel, roles, roleSummary } from './roles';

describe('the client’s roles', () => {
  it('are the four roles of the design', () => {
    expect([...roles].sort()).toEqual(['accountant', 'admin', 'engineer', 'operator']);
  });

  it('has a label and a one-line summary for each role', () => {
    for (const role of roles) {
      expect(roleLabel[role]).toEqual(expect.any(String));
      expect(roleSummary[role]).toMatch(/\.$/);
    }
    expect(roleLabel.admin).toBe('Administrator');
  });

  it('passes on the design’s matrix: only an accountant or an admin closes a month, only an admin reopens one', () => {
    expect(roles.filter((role) => can(role, 'closePeriod'))).toEqual(['accountant', 'admin']);
    expect(roles.filter((role) => can(role, 'reopenPeriod'))).toEqual(['admin']);
    expect(roles.filter((role) => can(role, 'respondToAlarms'))).toEqual(['operator', 'engineer', 'admin']);
  });
});
