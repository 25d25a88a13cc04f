import { RangeCheckScreen } from '@/components/screens/RangeCheckScreen';

export default function RangeCheckRoute() {
  return <RangeCheckScreen />;
}
