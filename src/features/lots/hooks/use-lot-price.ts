import { useShopMoney } from '@/lib/shop-currency';
import { centsPerKgToUnit, type PriceUnit } from '../utils/price-per-unit';

/** A lot's price per kg read per `unit`: 2450 per kg, 'lb' → "$11.11 / lb". */
export function useLotPrice(unit: PriceUnit) {
  const { money, pricePerKg } = useShopMoney();
  return (centsPerKg: number) => {
    if (unit === 'kg') return pricePerKg(centsPerKg);
    const amount = money(centsPerKgToUnit(centsPerKg, unit));
    return amount ? `${amount} / lb` : '';
  };
}
