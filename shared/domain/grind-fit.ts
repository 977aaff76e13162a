/**
 * Whether a grind suits the brew method a subscriber chose (the method sets the rest; the grind is
 * what we grind for their brewer). Whole bean suits any method: they grind it themselves. A hand
 * press brews well from fine to medium, so it suits both (common practice).
 *
 * - `grindMismatch(brewMethod, grind)`: null when the two fit, else why they do not, to ask the
 *   subscriber to confirm.
 */
import { grindLabels, type BrewMethod, type Grind } from './vocabulary';

// Espresso needs a fine grind for its 25–30 s, 9-bar extraction; a moka pot a fine-to-medium one
// (common practice). Filter grinds (medium to coarse) under-extract and run fast there.
const tooCoarseForEspresso: readonly Grind[] = ['pour-over', 'drip', 'french-press', 'cold-brew'];
// Filter and immersion brewers (pour-over, drip, French press, cold brew) want medium to coarse:
// an espresso or moka grind over-extracts, and clogs a paper filter or passes a press's mesh
// (common practice).
const tooFineForFilter: readonly Grind[] = ['espresso', 'moka-pot'];

export function grindMismatch(brewMethod: BrewMethod, grind: Grind): string | null {
  if (brewMethod === 'espresso' && tooCoarseForEspresso.includes(grind)) {
    return `A ${grindLabels[grind].toLowerCase()} grind is too coarse for espresso: the shot runs fast and tastes thin.`;
  }
  if (brewMethod === 'filter' && tooFineForFilter.includes(grind)) {
    return `A ${grindLabels[grind].toLowerCase()} grind is too fine for filter brewing: it tastes bitter and can clog the filter or pass the press's mesh.`;
  }
  return null;
}
