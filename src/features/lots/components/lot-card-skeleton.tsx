import { Skeleton } from '@/components/ui/skeleton';

/** The shape of a lot card while lots load, so the page does not jump when they arrive. */
export function LotCardSkeleton() {
  return (
    <div aria-hidden="true" className="flex h-full flex-col overflow-hidden rounded-card border border-rule bg-sheet">
      <Skeleton className="aspect-[4/3] rounded-none" />
      <div className="flex flex-col gap-3 p-4">
        <Skeleton className="h-4 w-1/2" />
        <Skeleton className="h-6 w-3/4" />
        <div className="grid grid-cols-2 gap-2">
          <Skeleton className="h-9" />
          <Skeleton className="h-9" />
          <Skeleton className="h-9" />
          <Skeleton className="h-9" />
        </div>
        <Skeleton className="h-6 w-2/3" />
        <Skeleton className="mt-2 h-7" />
      </div>
    </div>
  );
}
