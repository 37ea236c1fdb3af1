import { WorkFormScreen } from '@/src/screens/operations/WorkFormScreen';

export default function NewWorkRoute() {
  return <WorkFormScreen />;
}
