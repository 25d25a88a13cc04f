import { LatestContractDaysPanel } from '@/components/meter-runs/LatestContractDaysPanel';
import { MonthlyVolumesScreen } from '@/components/screens/MonthlyVolumesScreen';

/** Totals: the chosen site's meter runs' latest contract days (leading to their daily totals), and its month. */
export default function TotalsRoute() {
  return <MonthlyVolumesScreen siteExtra={(siteId) => <LatestContractDaysPanel siteId={siteId} />} />;
}
