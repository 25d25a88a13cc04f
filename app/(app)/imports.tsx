import { ImportsScreen } from '@/components/screens/ImportsScreen';

export default function ImportsRoute() {
  return <ImportsScreen />;
}
