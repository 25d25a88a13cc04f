import { areaByKey, areasForRole } from '@/constants/areas';
import { groupAreas } from './navGroups';

describe('groupAreas', () => {
  it('puts an administrator’s areas under Operations, Engineering and Administration, in table order', () => {
    const groups = groupAreas(areasForRole('admin'));
    expect(groups.map((group) => group.title)).toEqual(['Operations', 'Engineering', 'Administration']);
    expect(groups.map((group) => group.areas.map((area) => area.key))).toEqual([
      ['live', 'meter-runs', 'alarms', 'totals'],
      ['imports', 'setup', 'range-check', 'range-health', 'care-due', 'corrections'],
      ['audit', 'users', 'devices', 'mail'],
    ]);
  });

  it('leaves out a group the role has no area in', () => {
    const groups = groupAreas(areasForRole('accountant'));
    expect(groups.map((group) => group.title)).toEqual(['Operations', 'Administration']);
    expect(groups[1].areas.map((area) => area.key)).toEqual(['audit']);
  });

  it('starts a new heading when a group comes back after another, rather than reordering the areas', () => {
    const groups = groupAreas([areaByKey('live'), areaByKey('setup'), areaByKey('alarms')]);
    expect(groups.map((group) => group.title)).toEqual(['Operations', 'Engineering', 'Operations']);
  });

  it('gives no groups for no areas', () => {
    expect(groupAreas([])).toEqual([]);
  });
});
