import clsx from 'clsx';
import { Link } from 'react-router-dom';
import { weekdayLabels, weekdays } from '@shared/domain/vocabulary';
import type { CalendarDay } from '@shared/schemas/roastery';
import { paths } from '@/config/paths';
import { formatDayLongNoYear } from '@/lib/dates';
import { formatLoad } from '../utils/calendar-format';
import { monthWeeks } from '../utils/calendar-month';

type RoastCalendarMonthProps = {
  month: string;
  days: CalendarDay[];
  today: string;
  selected?: string;
  onChangeDay: (day: CalendarDay) => void;
};

/** Planned green against the day's capacity, drawn as a bar and written out. */
function LoadBar({ day }: { day: CalendarDay }) {
  const share = day.capacityGrams > 0 ? Math.min(1, day.plannedGreenGrams / day.capacityGrams) : 0;
  const over = day.plannedGreenGrams > day.capacityGrams;
  return (
    <div className="mt-1">
      <div aria-hidden="true" className="h-2 overflow-hidden rounded-pill bg-paper-shade">
        <div className={clsx('h-full rounded-pill', over ? 'bg-alert' : 'bg-leaf')} style={{ width: `${Math.round(share * 100)}%` }} />
      </div>
      <p className={clsx('mt-0.5 text-caption tabular-nums', over && 'font-semibold text-alert')}>
        {formatLoad(day.plannedGreenGrams)} of {formatLoad(day.capacityGrams)} green{over ? ' (over capacity)' : ''}
      </p>
    </div>
  );
}

/** A day's record from its recorded batches: what went into the roaster and what came out. */
function RoastedFigures({ roasted }: { roasted: CalendarDay['roasted'] }) {
  return (
    <p className="mt-1 text-caption tabular-nums">
      Roasted {formatLoad(roasted.greenGrams)} green in {roasted.batches} {roasted.batches === 1 ? 'batch' : 'batches'}, {formatLoad(roasted.roastedGrams)} out
    </p>
  );
}

function DayCell({ day, isToday, isSelected, onChange }: { day: CalendarDay; isToday: boolean; isSelected: boolean; onChange: () => void }) {
  const dayNumber = Number(day.date.slice(8));
  const state = day.open ? 'Roast day' : day.overridden ? 'Closed' : 'No roasting';
  return (
    <td
      className={clsx(
        'h-32 border border-rule p-2 align-top',
        day.open ? 'bg-sheet' : 'bg-paper-shade',
        isSelected && 'outline-3 -outline-offset-3 outline-focus',
      )}
    >
      <div className="flex items-baseline justify-between gap-1">
        <time dateTime={day.date} className={clsx('font-heading font-semibold', isToday && 'rounded-pill bg-ink px-1.5 text-paper')}>
          <span aria-hidden="true">{dayNumber}</span>
          <span className="sr-only">
            {formatDayLongNoYear(day.date)}
            {isToday ? ', today' : ''}
          </span>
        </time>
        <span className={clsx('text-caption font-semibold', day.open ? 'text-ok' : 'text-ink-muted')}>{state}</span>
      </div>
      {day.roasted.batches > 0 ? <RoastedFigures roasted={day.roasted} /> : day.open ? <LoadBar day={day} /> : null}
      {day.holiday ? <p className="mt-1 text-caption font-semibold text-caution">{day.holiday}</p> : null}
      <p className={clsx('text-caption', day.shipOpen ? 'text-ink' : 'text-ink-muted')}>{day.shipOpen ? 'Ships' : 'No shipping'}</p>
      {day.ordersCount > 0 ? (
        <p className="text-caption">
          {day.ordersCount} {day.ordersCount === 1 ? 'order' : 'orders'}
        </p>
      ) : null}
      {day.note ? <p className="mt-1 line-clamp-2 text-caption text-ink-muted">{day.note}</p> : null}
      <div className="mt-1 flex flex-wrap items-baseline gap-x-3">
        <Link to={paths.roastery.daySheet.getHref(day.date)} className="text-caption font-semibold text-leaf underline">
          Day Sheet<span className="sr-only"> for {formatDayLongNoYear(day.date)}</span>
        </Link>
        <button type="button" className="cursor-pointer text-caption font-semibold text-leaf underline" aria-pressed={isSelected} onClick={onChange}>
          Change<span className="sr-only"> {formatDayLongNoYear(day.date)}</span>
        </button>
      </div>
    </td>
  );
}

/** One month of roast days, Monday first. */
export function RoastCalendarMonth({ month, days, today, selected, onChangeDay }: RoastCalendarMonthProps) {
  const byDate = new Map(days.map((day) => [day.date, day]));
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[48rem] table-fixed border-collapse">
        <caption className="sr-only">Roast days in the month, Monday first</caption>
        <thead>
          <tr>
            {weekdays.map((weekday) => (
              <th key={weekday} scope="col" className="px-2 py-1 text-left text-small font-semibold">
                <abbr title={weekdayLabels[weekday]} className="no-underline">
                  {weekdayLabels[weekday].slice(0, 3)}
                </abbr>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {monthWeeks(month).map((week) => (
            <tr key={week.find(Boolean) ?? 'week'}>
              {week.map((date, index) => {
                const day = date ? byDate.get(date) : undefined;
                if (!date || !day) return <td key={date ?? `blank-${index}`} className="border border-rule bg-paper" />;
                return <DayCell key={date} day={day} isToday={date === today} isSelected={date === selected} onChange={() => onChangeDay(day)} />;
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
