const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const kilos = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });

/** 18_240 → "18.2 kg"; 800 → "800 g": loads read at a glance. */
export function formatLoad(value: number): string {
  return value < 1000 ? `${grams.format(value)} g` : `${kilos.format(value / 1000)} kg`;
}
