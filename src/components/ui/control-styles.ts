/** The look of text inputs and selects. */
export const controlStyles = 'block min-h-11 w-full rounded-control border border-rule-strong bg-sheet px-3 py-2 text-body text-ink placeholder:text-ink-muted';
