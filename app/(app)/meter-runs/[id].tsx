import { useLocalSearchParams } from 'expo-router';

import { UpcomingScreen } from '@/components/screens/UpcomingScreen';

export default function MeterRunRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <UpcomingScreen
      area="meter-runs"
      lead={`Meter run ${id}: its live readings and compensated flow, trends, hourly and contract-day records with coverage and flags, and its configuration versions.`}
    />
  );
}
