import { deferredScreen } from '@/src/screens/deferredRoute';

const AuditScreen = deferredScreen((s) => s.AuditScreen);

export default function AuditRoute() {
  return <AuditScreen />;
}
