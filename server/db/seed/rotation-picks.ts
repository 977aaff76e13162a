// Roaster's Rotation picks (invented staff choices), from five weeks back to two weeks ahead.
import type * as schema from '../schema/index';
import type { ScenarioContext } from './scenario-context';
import { earlier, type Insert } from './scenario-values';

export function demoRotationPicks({ cal, clock, catalogue, accounts }: ScenarioContext) {
  const { today } = cal;
  const rotationPicks: Insert<typeof schema.rotationPicks>[] = [];
  const pickByDate = new Map<string, string>();
  const { lotId, rotationLots } = catalogue;
  for (let d = cal.addDays(today, -35), i = 0; d <= cal.addDays(today, 14); d = cal.addDays(d, 1)) {
    if (!cal.isOpenRoastDay(d)) continue;
    const code = rotationLots[i % rotationLots.length] as string;
    i += 1;
    pickByDate.set(d, lotId(code));
    const createdAt = earlier(cal.at(cal.addDays(d, -6), '09:00'), clock.daysAgo(0, 30));
    rotationPicks.push({ roastDate: d, lotId: lotId(code), note: 'Demo pick (invented)', pickedBy: accounts.roasterId, createdAt, updatedAt: createdAt });
  }
  return { rotationPicks, pickedLotOn: (roastDate: string) => pickByDate.get(roastDate) as string };
}
