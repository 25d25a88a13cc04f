import { AuditLogScreen } from '@/components/screens/AuditLogScreen';

export default function AuditRoute() {
  return <AuditLogScreen />;
}
