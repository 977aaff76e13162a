import { CircleAlert, RotateCcw } from 'lucide-react';
import { ApiError } from '@/lib/api-client';
import { Button } from './button';

function describe(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something unexpected went wrong.';
}

export function ErrorState({ title, error, onRetry }: { title: string; error: unknown; onRetry: () => void }) {
  return (
    <div role="alert" className="rounded-card border border-alert/40 bg-alert-wash px-6 py-8 text-center">
      <CircleAlert aria-hidden="true" className="mx-auto size-7 text-alert" />
      <h2 className="mt-2 text-h3 text-alert">{title}</h2>
      <p className="mx-auto mt-1 max-w-prose text-ink">{describe(error)}</p>
      <Button variant="secondary" className="mt-5" onClick={onRetry}>
        <RotateCcw aria-hidden="true" className="size-4" />
        Try again
      </Button>
    </div>
  );
}
