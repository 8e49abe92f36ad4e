import { ShiftSheetsPage } from '@/features/shift-sheets';
import { useMe } from '@/lib/auth';

export default function ShiftSheetsRoute() {
  const me = useMe();
  if (!me.data) return null;
  return <ShiftSheetsPage role={me.data.role} />;
}
