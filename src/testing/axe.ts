import axe from 'axe-core';
import { expect } from 'vitest';

/**
 * axe-core's WCAG 2.0–2.2 A and AA rules on the rendered page. Contrast needs a real layout and
 * is left to the browser test; each violation reads "rule: help (where)".
 */
export async function axeViolations(): Promise<string[]> {
  const results = await axe.run(document.body, {
    runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'] },
    rules: { 'color-contrast': { enabled: false } },
  });
  expect(results.passes.length).toBeGreaterThan(0);
  return results.violations.map((violation) => `${violation.id}: ${violation.help} (${violation.nodes.map((node) => node.target.join(' ')).join(', ')})`);
}
