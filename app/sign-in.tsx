import { SignInScreen } from '@/src/screens/signIn/SignInScreen';

export default function SignInRoute() {
  return <SignInScreen />;
}
