import { MonthlyVolumesScreen } from '@/components/screens/MonthlyVolumesScreen';

export default function TotalsRoute() {
  return <MonthlyVolumesScreen />;
}
