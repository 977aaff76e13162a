import type { OrderStatus } from '@shared/domain/vocabulary';
import { Badge } from '@/components/ui/badge';
import { orderStatusLabels } from '../utils/order-status';

export function OrderStatusBadge({ status }: { status: OrderStatus }) {
  const { label, tone } = orderStatusLabels[status];
  return <Badge tone={tone}>{label}</Badge>;
}
