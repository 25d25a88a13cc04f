/**
 * Who may open which area. The expected roles come from the product's role matrix in
 * shared/DESIGN.md ("Roles"), written out here by hand, not read from shared/auth/roles.ts.
 */
import { areaByKey, areaForPath, areaGroupTitle, areaKeys, areas, areasForRole, roleMayOpen } from './areas';

/** DESIGN.md "Roles", row by row, as the areas need them. */
const everyone = ['operator', 'engineer', 'accountant', 'admin'];
const designMatrix: Record<string, string[]> = {
  // "live view, trends, totals, balances": yes for every role
  live: everyone,
  'meter-runs': everyone,
  alarms: everyone,
  totals: everyone,
  // "import readings and field totals": engineer, admin
  imports: ['engineer', 'admin'],
  // "sites, meter runs, transmitters, configuration versions, calibrations": engineer, admin
  setup: ['engineer', 'admin'],
  'range-check': ['engineer', 'admin'],
  'range-health': ['engineer', 'admin'],
  'care-due': ['engineer', 'admin'],
  // "propose a correction": engineer, admin
  corrections: ['engineer', 'admin'],
  // "audit log": read for engineer, accountant, admin
  audit: ['engineer', 'accountant', 'admin'],
  // "users, device credentials, mail outbox": admin
  users: ['admin'],
  devices: ['admin'],
  mail: ['admin'],
};

describe('the area table', () => {
  it('has one entry per area key, in the order of the keys, with no path used twice', () => {
    expect(areas.map((area) => area.key)).toEqual([...areaKeys]);
    expect(new Set(areas.map((area) => area.href)).size).toBe(areas.length);
  });

  it.each(Object.entries(designMatrix))('lets exactly the roles of the design matrix open %s', (key, roles) => {
    expect([...areaByKey(key as (typeof areaKeys)[number]).roles].sort()).toEqual([...roles].sort());
  });

  it('puts only areas every role opens in the phone bottom bar, so no one gets an empty bar', () => {
    const primary = areas.filter((area) => area.primary);
    expect(primary.map((area) => area.key)).toEqual(['live', 'meter-runs', 'alarms', 'totals']);
    for (const area of primary) expect([...area.roles].sort()).toEqual([...everyone].sort());
  });

  it('gives every area a group with a heading', () => {
    for (const area of areas) expect(areaGroupTitle[area.group]).toEqual(expect.any(String));
  });

  it('refuses an unknown area key, naming it', () => {
    expect(() => areaByKey('billing' as never)).toThrow('areaByKey: unknown area key "billing"');
  });
});

describe('areasForRole', () => {
  it('gives an operator the live board, meter runs, alarms and totals only', () => {
    expect(areasForRole('operator').map((area) => area.key)).toEqual(['live', 'meter-runs', 'alarms', 'totals']);
  });

  it('gives an accountant the operations areas and the audit log', () => {
    expect(areasForRole('accountant').map((area) => area.key)).toEqual([
      'live',
      'meter-runs',
      'alarms',
      'totals',
      'audit',
    ]);
  });

  it('gives an engineer everything but users, devices and the mail outbox', () => {
    expect(areasForRole('engineer').map((area) => area.key)).toEqual(
      areaKeys.filter((key) => !['users', 'devices', 'mail'].includes(key)),
    );
  });

  it('gives an administrator every area', () => {
    expect(areasForRole('admin').map((area) => area.key)).toEqual([...areaKeys]);
  });
});

describe('roleMayOpen', () => {
  it('says an operator may not open set-up while an engineer may', () => {
    expect(roleMayOpen('operator', 'setup')).toBe(false);
    expect(roleMayOpen('engineer', 'setup')).toBe(true);
  });

  it('keeps the user list for administrators', () => {
    expect(roleMayOpen('engineer', 'users')).toBe(false);
    expect(roleMayOpen('admin', 'users')).toBe(true);
  });
});

describe('areaForPath', () => {
  it('puts the root path, and only the root path, in the live board', () => {
    expect(areaForPath('/')?.key).toBe('live');
    expect(areaForPath('')?.key).toBe('live');
  });

  it('puts a detail page in the area of its parent path', () => {
    expect(areaForPath('/meter-runs/42')?.key).toBe('meter-runs');
    expect(areaForPath('/setup/sites/7/meter-runs')?.key).toBe('setup');
  });

  it('ignores trailing slashes', () => {
    expect(areaForPath('/alarms/')?.key).toBe('alarms');
    expect(areaForPath('/alarms///')?.key).toBe('alarms');
  });

  it('does not confuse two areas whose paths share a beginning', () => {
    expect(areaForPath('/range-check')?.key).toBe('range-check');
    expect(areaForPath('/range-health/3')?.key).toBe('range-health');
    expect(areaForPath('/meter-runsx')).toBeUndefined();
  });

  it('finds no area for a path outside every area, such as the sign-in screen', () => {
    expect(areaForPath('/sign-in')).toBeUndefined();
    expect(areaForPath('/nowhere/at/all')).toBeUndefined();
  });
});
