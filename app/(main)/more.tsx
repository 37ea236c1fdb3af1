import { MoreMenu } from '@/src/components/nav/MoreMenu';

export default function MoreRoute() {
  return <MoreMenu />;
}
