import clsx from 'clsx';
import { createContext, useContext, type ComponentProps } from 'react';

/**
 * Tables share one set of parts so cells pad alike everywhere. Three looks: `panel`, a table on a
 * card with a shaded head (lists and histories); `sheet`, ruled under every row and boxed in black
 * when printed (the day sheet, the pack list, trace reports); `prose`, a small table in running
 * text (guides), ruled under each row with no frame.
 */
type TableVariant = 'panel' | 'sheet' | 'prose';

const VariantContext = createContext<TableVariant>('panel');

type Align = 'left' | 'right';

const cellPadding: Record<TableVariant, string> = { panel: 'px-3 py-2', sheet: 'px-3 py-2', prose: 'py-2 pr-4' };
const sheetCell = 'border-b border-rule print:border print:border-black';

/** The card a table sits on, scrolling sideways on a narrow screen. */
export function TableFrame({ className, ...props }: ComponentProps<'div'>) {
  return <div className={clsx('overflow-x-auto rounded-card border border-rule bg-sheet', className)} {...props} />;
}

export function Table({ variant = 'panel', className, ...props }: ComponentProps<'table'> & { variant?: TableVariant }) {
  return (
    <VariantContext.Provider value={variant}>
      <table className={clsx('w-full border-collapse text-left', variant === 'panel' && 'text-small', className)} {...props} />
    </VariantContext.Provider>
  );
}

export function TableHead({ className, ...props }: ComponentProps<'thead'>) {
  const variant = useContext(VariantContext);
  return (
    <thead
      className={clsx(variant === 'panel' && 'bg-paper-shade', variant === 'prose' && '[&>tr]:border-b [&>tr]:border-rule-strong', className)}
      {...props}
    />
  );
}

export function TableBody({ className, ...props }: ComponentProps<'tbody'>) {
  const variant = useContext(VariantContext);
  return (
    <tbody
      className={clsx(variant === 'panel' && '[&>tr]:border-t [&>tr]:border-rule', variant === 'prose' && '[&>tr]:border-b [&>tr]:border-rule', className)}
      {...props}
    />
  );
}

// A class given to a cell replaces the default of its kind (padding on one axis, weight).
const classGroup = (token: string) => {
  const kind = /^(px|py|pt|pb|pr|font)-/.exec(token)?.[1];
  return kind === 'pt' || kind === 'pb' ? 'py' : kind;
};

function cellClass(variant: TableVariant, align: Align, className: string | undefined, ...defaults: string[]) {
  const given = new Set((className ?? '').split(/\s+/).map(classGroup).filter(Boolean));
  const base = [cellPadding[variant], 'align-top', ...defaults]
    .join(' ')
    .split(' ')
    .filter((token) => token && !given.has(classGroup(token)));
  return clsx(base, variant === 'sheet' && sheetCell, align === 'right' ? 'text-right tabular-nums' : 'text-left', className);
}

/** A column heading. */
export function TableHeader({ align = 'left', className, ...props }: ComponentProps<'th'> & { align?: Align }) {
  const variant = useContext(VariantContext);
  return <th scope="col" className={cellClass(variant, align, className, 'font-semibold', variant === 'sheet' ? 'text-small' : '')} {...props} />;
}

/** The cell that names its row (read out before each of the row's cells). */
export function TableRowHeader({ align = 'left', className, ...props }: ComponentProps<'th'> & { align?: Align }) {
  const variant = useContext(VariantContext);
  return <th scope="row" className={cellClass(variant, align, className, 'font-normal')} {...props} />;
}

export function TableCell({ align = 'left', className, ...props }: ComponentProps<'td'> & { align?: Align }) {
  const variant = useContext(VariantContext);
  return <td className={cellClass(variant, align, className)} {...props} />;
}
