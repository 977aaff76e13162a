import { afterEach, beforeEach, vi } from 'vitest';

// A stray console.error means something went wrong that no assertion caught.
let errors: unknown[][] = [];

beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});

afterEach(() => {
  vi.mocked(console.error).mockRestore();
  if (errors.length > 0) {
    const first = errors[0]?.map((part) => (part instanceof Error ? part.stack : String(part))).join(' ');
    throw new Error(`console.error was called ${errors.length} time(s); first: ${first}`);
  }
});
