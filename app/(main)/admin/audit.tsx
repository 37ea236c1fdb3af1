import { AuditScreen } from '@/src/screens/audit/AuditScreen';

export default function AuditRoute() {
  return <AuditScreen />;
}
