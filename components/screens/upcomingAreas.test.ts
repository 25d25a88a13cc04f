/** Who gets which action comes from the role matrix of shared/DESIGN.md ("Roles"). */
import { actionLinesFor, upcomingAreas } from './upcomingAreas';

const totals = upcomingAreas.totals;

describe('actionLinesFor', () => {
  it('tells an accountant they will close months and export volumes, but not reopen a month', () => {
    if (!totals) throw new Error('totals is still a placeholder');
    expect(actionLinesFor(totals, 'accountant')).toEqual([
      'You will be able to close a month, locking its records against change.',
      'Reopening a closed month is for administrators.',
      'You will be able to export monthly volumes as CSV or Excel.',
    ]);
  });

  it('tells an operator which roles each totals action is for', () => {
    if (!totals) throw new Error('totals is still a placeholder');
    expect(actionLinesFor(totals, 'operator')).toEqual([
      'Closing a month is for accountants and administrators.',
      'Reopening a closed month is for administrators.',
      'Exporting volumes is for engineers, accountants and administrators.',
    ]);
  });

  it('leaves the corrections placeholder out now that corrections have a screen', () => {
    expect(upcomingAreas.corrections).toBeUndefined();
  });

  it('gives no lines for an area without role-dependent actions', () => {
    expect(actionLinesFor({ lead: 'Coming soon.' }, 'admin')).toEqual([]);
  });
});
