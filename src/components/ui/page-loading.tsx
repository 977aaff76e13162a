/** Shown while the first page of a visit loads its code. */
export function PageLoading() {
  return (
    <div role="status" className="flex min-h-[50vh] items-center justify-center text-ink-muted">
      <span className="motion-safe:animate-pulse">Loading Restday…</span>
    </div>
  );
}
