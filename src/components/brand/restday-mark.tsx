/** Restday's mark: a day settling on the horizon. Decorative; the name beside it is the text. */
export function RestdayMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={className}>
      <rect width="32" height="32" rx="8" fill="var(--color-leaf)" />
      <path d="M8 20a8 8 0 0 1 16 0z" fill="var(--color-crema)" />
      <rect x="6" y="21.5" width="20" height="2.5" rx="1.25" fill="var(--color-sheet)" />
    </svg>
  );
}
