import { MyNoticesScreen } from '@/src/screens/notices/MyNoticesScreen';

export default function MyNoticesRoute() {
  return <MyNoticesScreen />;
}
