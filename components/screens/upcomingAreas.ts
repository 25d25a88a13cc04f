/**
 * What each area not yet built will hold, in the trade's words, and which of its actions a
 * role gets. Later issues replace these placeholders with the real screens.
 */
import type { AreaKey } from '@/constants/areas';
import { can, type Capability, type Role } from '@/constants/roles';

export interface UpcomingArea {
  lead: string;
  /** Actions in this area that depend on the role, with how to say yes and no. */
  actions?: { capability: Capability; allowed: string; refused: string }[];
  /** A safety note shown where the area's work touches equipment in the field. */
  caution?: string;
}

export const upcomingAreas: Partial<Record<AreaKey, UpcomingArea>> = {
  live: {
    lead:
      "Every meter run's flow rate now and today's running total since the site's contract hour, with the DP transmitter in use on a stacked pair. Anything abnormal is listed first.",
  },
  'meter-runs': {
    lead:
      'Each meter run with its site, primary element, fluid and transmitters. Open one for its trends, hourly records and configuration versions.',
  },
  alarms: {
    lead:
      'Alarms by priority and state (active, acknowledged, returned to normal, shelved): DP low in range, over range, frozen or stale transmitters, calibrations due, reconciliations out of tolerance.',
    actions: [
      {
        capability: 'respondToAlarms',
        allowed: 'You will be able to acknowledge alarms and shelve them for a set time with a reason.',
        refused: 'Your role sees alarms; acknowledging and shelving them is for operators, engineers and administrators.',
      },
    ],
  },
  totals: {
    lead:
      'Hourly, contract-day and monthly totals per meter run and site (mass, actual volume, volume at base conditions, energy) with coverage, flags and uncertainty, and the balance groups beside them.',
    actions: [
      {
        capability: 'closePeriod',
        allowed: 'You will be able to close a month, locking its records against change.',
        refused: 'Closing a month is for accountants and administrators.',
      },
      {
        capability: 'reopenPeriod',
        allowed: 'You will be able to reopen a closed month, giving a reason.',
        refused: 'Reopening a closed month is for administrators.',
      },
      {
        capability: 'exportVolumes',
        allowed: 'You will be able to export monthly volumes as CSV or Excel.',
        refused: 'Exporting volumes is for engineers, accountants and administrators.',
      },
    ],
  },
  imports: {
    lead:
      'Upload CSV files of readings (time, tag, value, quality) and field totals. Each import reports the rows read, imported, duplicated and rejected, line by line.',
  },
  setup: {
    lead:
      'Sites with their time zone, contract hour and base conditions; meter runs with their primary element and fluid; transmitters with their ranges and stacked pairs; calibrations and element changes with effective dates.',
    caution:
      'Changing a primary element or a transmitter in the field means working on pressurised lines: follow your site procedures, local codes and licensed practice.',
  },
  'range-check': {
    lead:
      "Find DP readings that sit low in their transmitter's range, where the error as a share of the reading grows, and plan a re-range or a low-range transmitter. A form and a plot will go here.",
  },
  corrections: {
    lead:
      'Propose a substitution or an adjustment for a period of a meter run, with a reason; another engineer or an administrator approves or rejects it. A closed month cannot be corrected.',
    actions: [
      {
        capability: 'approveCorrection',
        allowed: "You will be able to approve or reject other people's corrections, never your own.",
        refused: 'Approving corrections is for engineers and administrators.',
      },
    ],
  },
  devices: {
    lead:
      'Issue MQTT sign-in credentials for field devices, one site each. A device may publish only under its own site; its password is shown once.',
  },
};

/**
 * @param area the area's placeholder text
 * @param role the signed-in user's role
 * @returns one sentence per role-dependent action, saying whether this role gets it
 */
export function actionLinesFor(area: UpcomingArea, role: Role): string[] {
  return (area.actions ?? []).map((action) => (can(role, action.capability) ? action.allowed : action.refused));
}
