/**
 * The areas of the signed-in app and the capability that opens each: the one table that both
 * the navigation and the route guard read. Which roles hold a capability comes from the
 * product's matrix in shared/auth/roles.ts (shared/DESIGN.md, "Roles").
 */
import { capabilities, type Capability, type Role } from './roles';

export const areaKeys = [
  'live',
  'meter-runs',
  'alarms',
  'totals',
  'imports',
  'setup',
  'range-check',
  'range-health',
  'care-due',
  'corrections',
  'audit',
  'users',
  'devices',
  'mail',
] as const;
export type AreaKey = (typeof areaKeys)[number];

export interface Area {
  key: AreaKey;
  /** Name in the navigation and the header. */
  title: string;
  /** Shorter name for the phone's bottom bar. */
  shortTitle: string;
  /** Route path (expo-router groups are not part of the URL). */
  href: string;
  /** Holding this capability opens the area. */
  capability: Capability;
  /** The roles holding that capability. */
  roles: readonly Role[];
  /** Shown in the phone's bottom bar rather than under "More". */
  primary: boolean;
  /** Navigation group on wide screens. */
  group: 'operations' | 'engineering' | 'administration';
}

type AreaEntry = Omit<Area, 'roles'>;

const entries: readonly AreaEntry[] = [
  {
    key: 'live',
    title: 'Live board',
    shortTitle: 'Live',
    href: '/',
    capability: 'view',
    primary: true,
    group: 'operations',
  },
  {
    key: 'meter-runs',
    title: 'Meter runs',
    shortTitle: 'Runs',
    href: '/meter-runs',
    capability: 'view',
    primary: true,
    group: 'operations',
  },
  {
    key: 'alarms',
    title: 'Alarms',
    shortTitle: 'Alarms',
    href: '/alarms',
    capability: 'view',
    primary: true,
    group: 'operations',
  },
  {
    key: 'totals',
    title: 'Totals & month end',
    shortTitle: 'Totals',
    href: '/totals',
    capability: 'view',
    primary: true,
    group: 'operations',
  },
  {
    key: 'imports',
    title: 'Imports',
    shortTitle: 'Imports',
    href: '/imports',
    capability: 'importData',
    primary: false,
    group: 'engineering',
  },
  {
    key: 'setup',
    title: 'Set-up',
    shortTitle: 'Set-up',
    href: '/setup',
    capability: 'configure',
    primary: false,
    group: 'engineering',
  },
  // Finding readings low in range is part of keeping transmitters right: the set-up people's job.
  {
    key: 'range-check',
    title: 'Range check',
    shortTitle: 'Range',
    href: '/range-check',
    capability: 'configure',
    primary: false,
    group: 'engineering',
  },
  // How a meter run's recorded flow sat in its DP span, and what to change: the same people's job.
  {
    key: 'range-health',
    title: 'Range health',
    shortTitle: 'Health',
    href: '/range-health',
    capability: 'configure',
    primary: false,
    group: 'engineering',
  },
  // What is due in the care of the meters (calibrations, analyses, inspections): the people who record them.
  // The list itself (GET /api/sites/:id/care-due) is readable by every role.
  {
    key: 'care-due',
    title: 'Care due',
    shortTitle: 'Due',
    href: '/care-due',
    capability: 'configure',
    primary: false,
    group: 'engineering',
  },
  {
    key: 'corrections',
    title: 'Corrections',
    shortTitle: 'Corrections',
    href: '/corrections',
    capability: 'proposeCorrection',
    primary: false,
    group: 'engineering',
  },
  {
    key: 'audit',
    title: 'Audit log',
    shortTitle: 'Audit',
    href: '/audit',
    capability: 'readAuditLog',
    primary: false,
    group: 'administration',
  },
  {
    key: 'users',
    title: 'Users',
    shortTitle: 'Users',
    href: '/users',
    capability: 'administer',
    primary: false,
    group: 'administration',
  },
  {
    key: 'devices',
    title: 'Devices',
    shortTitle: 'Devices',
    href: '/devices',
    capability: 'administer',
    primary: false,
    group: 'administration',
  },
  {
    key: 'mail',
    title: 'Mail outbox',
    shortTitle: 'Mail',
    href: '/mail',
    capability: 'administer',
    primary: false,
    group: 'administration',
  },
];

export const areas: readonly Area[] = entries.map((entry) => ({ ...entry, roles: capabilities[entry.capability] }));

export const areaGroupTitle: Record<Area['group'], string> = {
  operations: 'Operations',
  engineering: 'Engineering',
  administration: 'Administration',
};

/**
 * @param key an area key
 * @returns the area's entry in the table
 */
export function areaByKey(key: AreaKey): Area {
  const found = areas.find((area) => area.key === key);
  if (!found) throw new Error(`areaByKey: unknown area key "${key}"`);
  return found;
}

/**
 * @param role the signed-in user's role
 * @returns the areas that role may open, in navigation order
 */
export function areasForRole(role: Role): Area[] {
  return areas.filter((area) => area.roles.includes(role));
}

/**
 * @param role the signed-in user's role
 * @param key an area key
 * @returns whether the role may open the area
 */
export function roleMayOpen(role: Role, key: AreaKey): boolean {
  return areaByKey(key).roles.includes(role);
}

/**
 * Finds the area a URL path belongs to: the longest area path that is the path itself or a
 * parent of it, so `/meter-runs/42` belongs to meter runs and `/` only to the live board.
 *
 * @param pathname a URL path such as `/meter-runs/42`
 * @returns the area, or undefined for a path outside every area
 */
export function areaForPath(pathname: string): Area | undefined {
  const path = pathname.replace(/\/+$/, '') || '/';
  let best: Area | undefined;
  for (const area of areas) {
    const matches = area.href === '/' ? path === '/' : path === area.href || path.startsWith(`${area.href}/`);
    if (matches && (!best || area.href.length > best.href.length)) best = area;
  }
  return best;
}
