import type { Config } from 'tailwindcss';

// Loaded by src/index.css through `@config`. Restday's design tokens (palette, type scale, radii)
// live in that file's `@theme` block so they are plain CSS variables as well as utilities; this
// file only names where class names are found.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
} satisfies Config;
