import { useLocalSearchParams } from 'expo-router';

import { SetupMeterRunScreen } from '@/components/screens/SetupMeterRunScreen';
import { SetupScreen } from '@/components/screens/SetupScreen';
import { SetupSiteScreen } from '@/components/screens/SetupSiteScreen';

/**
 * Set-up's three levels share one route, told apart by the query (/setup, /setup?site=3,
 * /setup?meterRun=7), so the static export keeps a single setup.html for every deep link.
 */
export default function SetupRoute() {
  const { site, meterRun } = useLocalSearchParams<{ site?: string; meterRun?: string }>();
  if (meterRun) return <SetupMeterRunScreen meterRunId={String(meterRun)} />;
  if (site) return <SetupSiteScreen siteId={String(site)} />;
  return <SetupScreen />;
}
