/** Who gets which action comes from the role matrix of shared/DESIGN.md ("Roles"). */
import { actionLinesFor, upcomingAreas } from './upcomingAreas';

describe('actionLinesFor', () => {
  it('leaves the totals placeholder out now that monthly volumes have a screen', () => {
    expect(upcomingAreas.totals).toBeUndefined();
  });

  it('leaves the corrections placeholder out now that corrections have a screen', () => {
    expect(upcomingAreas.corrections).toBeUndefined();
  });

  it('says yes to a role the matrix gives the action and names the roles to one it does not', () => {
    const area = {
      lead: 'A later area.',
      actions: [{ capability: 'closePeriod' as const, allowed: 'You may close.', refused: 'For accountants.' }],
    };
    expect(actionLinesFor(area, 'accountant')).toEqual(['You may close.']);
    expect(actionLinesFor(area, 'operator')).toEqual(['For accountants.']);
  });

  it('gives no lines for an area without role-dependent actions', () => {
    expect(actionLinesFor({ lead: 'Coming soon.' }, 'admin')).toEqual([]);
  });
});
