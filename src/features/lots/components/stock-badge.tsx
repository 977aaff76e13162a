import { Badge } from '@/components/ui/badge';
import { formatGrams } from '@/lib/format';

export function StockBadge({ stockGrams }: { stockGrams: number }) {
  if (stockGrams <= 0) return <Badge tone="alert">Out of stock</Badge>;
  return <Badge tone="ok">In stock · {formatGrams(stockGrams)}</Badge>;
}
