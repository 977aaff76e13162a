export function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only rounded-control bg-sheet px-4 py-2 font-semibold text-ink focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50"
    >
      Skip to content
    </a>
  );
}
