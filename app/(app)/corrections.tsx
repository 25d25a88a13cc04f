import { CorrectionsScreen } from '@/components/screens/CorrectionsScreen';

export default function CorrectionsRoute() {
  return <CorrectionsScreen />;
}
