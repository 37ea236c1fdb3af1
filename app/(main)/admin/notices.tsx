import { deferredScreen } from '@/src/screens/deferredRoute';

const NoticesAdminScreen = deferredScreen((s) => s.NoticesAdminScreen);

export default function NoticesAdminRoute() {
  return <NoticesAdminScreen />;
}
