import { ChevronLeft, ChevronRight } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { addDays, isIsoDate } from '@shared/domain/shop-time';
import { Button, buttonStyles } from '@/components/ui/button';
import { controlStyles } from '@/components/ui/control-styles';
import { paths } from '@/config/paths';

type DateSwitcherProps = { date: string; tab: 'roast' | 'pack' };

/** Steps a day back or forward, or jumps to any day, keeping the open tab. Key it by `date` so the picker follows. */
export function DateSwitcher({ date, tab }: DateSwitcherProps) {
  const navigate = useNavigate();
  const [chosen, setChosen] = useState(date);

  function go(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (isIsoDate(chosen)) void navigate(paths.roastery.daySheet.getHref(chosen, tab));
  }

  return (
    <nav aria-label="Roast days" className="flex flex-wrap items-end gap-2 print:hidden">
      <Link to={paths.roastery.daySheet.getHref(addDays(date, -1), tab)} className={buttonStyles('secondary')}>
        <ChevronLeft aria-hidden="true" className="size-4" />
        Previous day
      </Link>
      <Link to={paths.roastery.daySheet.getHref(addDays(date, 1), tab)} className={buttonStyles('secondary')}>
        Next day
        <ChevronRight aria-hidden="true" className="size-4" />
      </Link>
      <form onSubmit={go} className="flex items-end gap-2">
        <div>
          <label htmlFor="day-sheet-date" className="block text-small font-semibold">
            Go to a day
          </label>
          <input
            id="day-sheet-date"
            type="date"
            required
            value={chosen}
            onChange={(event) => setChosen(event.target.value)}
            className={`${controlStyles} mt-1`}
          />
        </div>
        <Button type="submit" variant="secondary">
          Open
        </Button>
      </form>
    </nav>
  );
}
