import { NoticesAdminScreen } from '@/src/screens/notices/NoticesAdminScreen';

export default function NoticesAdminRoute() {
  return <NoticesAdminScreen />;
}
