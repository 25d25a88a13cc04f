import { SignInScreen } from '@/components/screens/SignInScreen';

export default function SignInRoute() {
  return <SignInScreen />;
}
