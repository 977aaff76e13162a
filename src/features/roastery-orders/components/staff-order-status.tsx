import type { OrderStatus } from '@shared/domain/vocabulary';
import { Badge } from '@/components/ui/badge';
import { staffStatusLabels } from '../utils/order-labels';

export function StaffOrderStatus({ status }: { status: OrderStatus }) {
  const { label, tone } = staffStatusLabels[status];
  return <Badge tone={tone}>{label}</Badge>;
}
