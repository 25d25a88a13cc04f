/** Groups a role's areas under their headings, in table order, for the menus. */
import { areaGroupTitle, type Area } from '@/constants/areas';

export interface NavGroup {
  title: string;
  areas: Area[];
}

/**
 * @param areas the areas to show, in navigation order
 * @returns the non-empty groups, each with its title
 */
export function groupAreas(areas: readonly Area[]): NavGroup[] {
  const groups: NavGroup[] = [];
  for (const area of areas) {
    const title = areaGroupTitle[area.group];
    const last = groups[groups.length - 1];
    if (last && last.title === title) last.areas.push(area);
    else groups.push({ title, areas: [area] });
  }
  return groups;
}
