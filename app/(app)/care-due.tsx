import { useLocalSearchParams } from 'expo-router';

import { CareDueScreen } from '@/components/screens/CareDueScreen';

export default function CareDueRoute() {
  const { siteId } = useLocalSearchParams<{ siteId?: string }>();
  return <CareDueScreen siteId={siteId} />;
}
