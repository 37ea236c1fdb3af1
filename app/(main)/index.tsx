import { HomeScreen } from '@/src/screens/home/HomeScreen';

export default function HomeRoute() {
  return <HomeScreen />;
}
