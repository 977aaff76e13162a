// Label stock the bag labels print on, in PDF points (1 in = 72 pt exactly; 1 mm = 72 / 25.4 pt).

const POINTS_PER_INCH = 72;
const POINTS_PER_MM = 72 / 25.4;
const inches = (value: number) => value * POINTS_PER_INCH;
const mm = (value: number) => value * POINTS_PER_MM;

export const labelStockIds = ['single', 'letter-10', 'a4-10'] as const;
export type LabelStockId = (typeof labelStockIds)[number];

export interface LabelStock {
  id: LabelStockId;
  /** As the Pack List offers it. */
  name: string;
  page: { width: number; height: number };
  label: { width: number; height: number };
  columns: number;
  rows: number;
  /** Where the top-left label starts on the page. */
  origin: { x: number; y: number };
  /** From one label's left (top) edge to the next one's. */
  pitch: { x: number; y: number };
}

export const labelStocks: Record<LabelStockId, LabelStock> = {
  // A 4 × 3 in roll label for a desktop label printer, one per page (common practice).
  single: {
    id: 'single',
    name: 'One label a page (4 × 3 in, label printer)',
    page: { width: inches(4), height: inches(3) },
    label: { width: inches(4), height: inches(3) },
    columns: 1,
    rows: 1,
    origin: { x: 0, y: 0 },
    pitch: { x: inches(4), y: inches(3) },
  },
  // US Letter (8.5 × 11 in) sheet of 10 labels, 4 × 2 in, 2 across and 5 down: 0.5 in top and bottom
  // margins, 5/32 in side margins and a 3/16 in gap between the columns, so 2 × 4 + 3/16 + 2 × 5/32 = 8.5 in
  // (from memory of the common 10-up 4 × 2 in shipping-label sheet).
  'letter-10': {
    id: 'letter-10',
    name: 'US Letter sheet, 10 labels of 4 × 2 in',
    page: { width: inches(8.5), height: inches(11) },
    label: { width: inches(4), height: inches(2) },
    columns: 2,
    rows: 5,
    origin: { x: inches(5 / 32), y: inches(0.5) },
    pitch: { x: inches(4 + 3 / 16), y: inches(2) },
  },
  // A4 (210 × 297 mm, ISO 216) sheet of 10 labels, 99.1 × 57 mm, 2 across and 5 down: 6 mm top and
  // bottom margins, 4.65 mm side margins and a 2.5 mm gap, so 2 × 99.1 + 2.5 + 2 × 4.65 = 210 mm
  // (from memory of the common A4 10-up label sheet).
  'a4-10': {
    id: 'a4-10',
    name: 'A4 sheet, 10 labels of 99.1 × 57 mm',
    page: { width: mm(210), height: mm(297) },
    label: { width: mm(99.1), height: mm(57) },
    columns: 2,
    rows: 5,
    origin: { x: mm(4.65), y: mm(6) },
    pitch: { x: mm(101.6), y: mm(57) },
  },
};

export interface LabelSlot {
  /** 0 for the first sheet. */
  sheet: number;
  x: number;
  y: number;
}

/** Where the label at `index` (0-based, in print order) goes: across each row, then down, then the next sheet. */
export function labelSlot(stock: LabelStock, index: number): LabelSlot {
  if (!Number.isInteger(index) || index < 0) throw new RangeError(`A label index is a whole number from 0, not ${index}.`);
  const perSheet = stock.columns * stock.rows;
  const onSheet = index % perSheet;
  return {
    sheet: Math.floor(index / perSheet),
    x: stock.origin.x + (onSheet % stock.columns) * stock.pitch.x,
    y: stock.origin.y + Math.floor(onSheet / stock.columns) * stock.pitch.y,
  };
}
