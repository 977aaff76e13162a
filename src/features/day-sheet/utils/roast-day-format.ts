// Display formatting for the Day Sheet. Staff weigh to the gram, so grams stay exact here.

const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const percent = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 2 });

/** 4635 → "4,635 g" */
export function formatExactGrams(value: number): string {
  return `${grams.format(value)} g`;
}

/** 15 → "15.0 %"; 14.27 → "14.27 %" */
export function formatLossPct(value: number): string {
  return `${percent.format(value)} %`;
}

const MINUTES_SECONDS = /^(\d{1,3}):([0-5]\d)$/;

/** "11:45" → 705 seconds; anything else → null. Roast timers show minutes and seconds. */
export function parseMinutesSeconds(text: string): number | null {
  const match = MINUTES_SECONDS.exec(text.trim());
  if (!match) return null;
  return Number(match[1]) * 60 + Number(match[2]);
}

/** 705 → "11:45" */
export function formatMinutesSeconds(totalSeconds: number): string {
  const minutes = Math.floor(totalSeconds / 60);
  return `${minutes}:${String(totalSeconds % 60).padStart(2, '0')}`;
}
