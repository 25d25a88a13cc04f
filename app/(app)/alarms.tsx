import { useLocalSearchParams } from 'expo-router';

import { AlarmsScreen, type AlarmsScreenParams } from '@/components/screens/AlarmsScreen';

export default function AlarmsRoute() {
  const params = useLocalSearchParams<{ [K in keyof AlarmsScreenParams]: string }>();
  return <AlarmsScreen params={params} />;
}
