import { NotFoundScreen } from '@/components/screens/NotFoundScreen';

export default function NotFoundRoute() {
  return <NotFoundScreen />;
}
