import clsx from 'clsx';
import { useRef, type KeyboardEvent, type ReactNode } from 'react';

export const daySheetTabs = ['roast', 'pack'] as const;
export type DaySheetTab = (typeof daySheetTabs)[number];

const tabLabels: Record<DaySheetTab, string> = { roast: 'Roast List', pack: 'Pack List' };
/** What each tab's count counts: bags on the Roast List, orders on the Pack List. */
const countUnits: Record<DaySheetTab, [one: string, many: string]> = { roast: ['bag', 'bags'], pack: ['order', 'orders'] };

type DaySheetTabsProps = {
  selected: DaySheetTab;
  onSelect: (tab: DaySheetTab) => void;
  panels: Record<DaySheetTab, ReactNode>;
  /** Shown beside each tab's name once known. */
  counts?: Partial<Record<DaySheetTab, number>>;
};

/**
 * The Day Sheet's two tabs, as the WAI-ARIA tabs pattern: arrow keys, Home and End move between
 * tabs and select them; only the selected tab is in the Tab order. The selected tab lives in the URL.
 */
export function DaySheetTabs({ selected, onSelect, panels, counts = {} }: DaySheetTabsProps) {
  const tabRefs = useRef<Partial<Record<DaySheetTab, HTMLButtonElement | null>>>({});

  function moveTo(tab: DaySheetTab) {
    onSelect(tab);
    tabRefs.current[tab]?.focus();
  }

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    const index = daySheetTabs.indexOf(selected);
    const last = daySheetTabs.length - 1;
    const next: Record<string, number> = {
      ArrowRight: index === last ? 0 : index + 1,
      ArrowLeft: index === 0 ? last : index - 1,
      Home: 0,
      End: last,
    };
    const target = next[event.key];
    if (target === undefined) return;
    event.preventDefault();
    moveTo(daySheetTabs[target] as DaySheetTab);
  }

  return (
    <div>
      <div role="tablist" aria-label="Day Sheet" onKeyDown={onKeyDown} className="mb-6 flex gap-1 border-b border-rule print:hidden">
        {daySheetTabs.map((tab) => {
          const isSelected = tab === selected;
          return (
            <button
              key={tab}
              ref={(element) => {
                tabRefs.current[tab] = element;
              }}
              type="button"
              role="tab"
              id={`day-sheet-tab-${tab}`}
              aria-selected={isSelected}
              aria-controls={`day-sheet-panel-${tab}`}
              tabIndex={isSelected ? 0 : -1}
              onClick={() => onSelect(tab)}
              className={clsx(
                '-mb-px min-h-11 rounded-t-control border border-b-0 px-4 py-2 font-semibold',
                isSelected ? 'border-rule bg-sheet text-ink' : 'border-transparent text-ink-muted hover:text-ink',
              )}
            >
              {tabLabels[tab]}
              {counts[tab] === undefined ? null : (
                <span className="ml-2 rounded-pill bg-paper-shade px-2 py-0.5 text-caption text-ink">
                  <span className="sr-only">, </span>
                  {counts[tab].toLocaleString('en-US')}
                  <span className="sr-only"> {countUnits[tab][counts[tab] === 1 ? 0 : 1]}</span>
                </span>
              )}
            </button>
          );
        })}
      </div>
      {daySheetTabs.map((tab) => (
        <div key={tab} role="tabpanel" id={`day-sheet-panel-${tab}`} aria-labelledby={`day-sheet-tab-${tab}`} hidden={tab !== selected} tabIndex={0}>
          {tab === selected ? panels[tab] : null}
        </div>
      ))}
    </div>
  );
}
