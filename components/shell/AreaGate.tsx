/**
 * The route guard of the signed-in area: works out which area the address belongs to and shows
 * the screen only if the user's role may open it (the same table that builds the navigation).
 */
import { usePathname } from 'expo-router';
import type { ReactNode } from 'react';

import { areaForPath } from '@/constants/areas';
import type { Role } from '@/constants/roles';
import { NotAvailable } from './NotAvailable';

export function AreaGate({ role, children }: { role: Role; children: ReactNode }) {
  const area = areaForPath(usePathname());
  if (area && !area.roles.includes(role)) return <NotAvailable area={area} role={role} />;
  return <>{children}</>;
}
