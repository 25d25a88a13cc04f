/**
 * What each area not yet built will hold, in the trade's words, and which of its actions a
 * role gets. Later issues replace these placeholders with the real screens; an area leaves this
 * list when its screen is built (none is left: totals became monthly volumes in issue 10).
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

export const upcomingAreas: Partial<Record<AreaKey, UpcomingArea>> = {};

/**
 * @param area the area's placeholder text
 * @param role the signed-in user's role
 * @returns one sentence per role-dependent action, saying whether this role gets it
 */
export function actionLinesFor(area: UpcomingArea, role: Role): string[] {
  return (area.actions ?? []).map((action) => (can(role, action.capability) ? action.allowed : action.refused));
}
