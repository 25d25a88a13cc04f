import { UsersScreen } from '@/components/screens/UsersScreen';

export default function UsersRoute() {
  return <UsersScreen />;
}
