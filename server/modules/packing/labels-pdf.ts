import PDFDocument from 'pdfkit';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import { labelSlot, type LabelStock } from '@shared/domain/label-stock';
import type { PackBag, PackOrder } from '@shared/schemas/packing';
import type { PlaceOfBusiness } from '@shared/schemas/settings';
import { orderReference } from '../../../shared/domain/order-reference';

const MARGIN = 12;
/** Below this height (a 2 in sheet label) the facts go in two columns and the type is smaller. */
const COMPACT_BELOW = 180;

const dayFormat = new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
/** A shop-local day as the label prints it, e.g. "Dec 8, 2026" (read as UTC so it never shifts a day). */
const formatDay = (isoDate: string) => dayFormat.format(new Date(`${isoDate}T00:00:00Z`));

// The PDF standard fonts cover Windows-1252 only (PDF 32000-1, Annex D): ASCII, Latin-1 and these.
const winAnsiExtras = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
const fitsWinAnsi = (character: string) => {
  const code = character.codePointAt(0)!;
  return (code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || winAnsiExtras.has(character);
};
const unaccentable: Record<string, string> = { Đ: 'D', đ: 'd', Ł: 'L', ł: 'l', ı: 'i', Ħ: 'H', ħ: 'h' };

/** Text the standard fonts can print: other letters lose their accents ("Nguyễn" → "Nguyen"), anything else becomes "?". */
export function printable(text: string): string {
  return [...text]
    .map((character) => {
      if (fitsWinAnsi(character)) return character;
      const base = character.normalize('NFD').replace(/\p{M}/gu, '');
      if (base !== character && [...base].every(fitsWinAnsi)) return base;
      return unaccentable[character] ?? '?';
    })
    .join('');
}

/** The label's fact lines: roasted bags carry the roast fields, green bags only what green coffee has. */
function factsOf(bag: PackBag): [string, string][] {
  if (!bag.roastDate) return [['', 'Green coffee (unroasted)']];
  const facts: [string, string][] = [];
  if (bag.roastLevel) facts.push(['Roast level', roastLevelLabels[bag.roastLevel]]);
  if (bag.grind) facts.push(['Grind', grindLabels[bag.grind]]);
  facts.push(['Roasted', formatDay(bag.roastDate)]);
  if (bag.readyFrom) facts.push(['Ready from', formatDay(bag.readyFrom)]);
  if (bag.bestBefore) facts.push(['Best before', formatDay(bag.bestBefore)]);
  return facts;
}

/** The label's maker, as a packed food label names them: the shop and its place of business. */
export interface LabelMaker {
  shopName: string;
  placeOfBusiness: PlaceOfBusiness;
}

/** The place of business on one line, e.g. "210 Foundry Row, Unit 4, Wrenfield, CO 80999, US". */
const addressLine = (address: PlaceOfBusiness) =>
  [address.line1, address.line2, `${address.city}, ${address.region} ${address.postalCode}`, address.country].filter(Boolean).join(', ');

interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

function drawLabel(doc: PDFKit.PDFDocument, box: Box, maker: LabelMaker, order: PackOrder, bag: PackBag) {
  const compact = box.height < COMPACT_BELOW;
  const left = box.x + MARGIN;
  const top = box.y + (compact ? 9 : MARGIN);
  const bottom = box.y + box.height - (compact ? 9 : MARGIN);
  const width = box.width - 2 * MARGIN;
  const line = { width, lineBreak: false, ellipsis: true } as const;

  doc
    .font('Helvetica-Bold')
    .fontSize(compact ? 7 : 8)
    .fillColor('black')
    .text(printable(maker.shopName.toUpperCase()), left, top, { ...line, characterSpacing: compact ? 0 : 0.8 });
  doc
    .font('Helvetica')
    .fontSize(compact ? 6.5 : 7)
    .text(printable(addressLine(maker.placeOfBusiness)), left, top + (compact ? 8.5 : 10), line);
  const coffeeTop = top + (compact ? 18 : 22);
  doc
    .font('Helvetica-Bold')
    .fontSize(compact ? 12 : 15)
    .text(printable(bag.coffee), left, coffeeTop, line);
  doc
    .font('Helvetica')
    .fontSize(compact ? 8 : 9)
    .text(bag.lotCode ? `Lot ${printable(bag.lotCode)}` : 'Lot to be picked', left, coffeeTop + (compact ? 14 : 19), line);

  const factsTop = coffeeTop + (compact ? 26 : 36);
  const rowHeight = compact ? 10 : 13;
  const facts = factsOf(bag);
  // Compact labels set the facts in two columns of at most three rows.
  const perColumn = compact ? 3 : facts.length;
  const columnWidth = compact ? width / 2 : width;
  const labelWidth = compact ? 50 : 70;
  facts.forEach(([label, value], index) => {
    const x = left + Math.floor(index / perColumn) * columnWidth;
    const y = factsTop + (index % perColumn) * rowHeight;
    const size = compact ? 7.5 : 9;
    if (label) {
      doc.font('Helvetica').fontSize(size).text(`${label}:`, x, y, { width: labelWidth, lineBreak: false });
      doc
        .font('Helvetica-Bold')
        .fontSize(size)
        .text(value, x + labelWidth + 2, y, { width: columnWidth - labelWidth - 4, lineBreak: false, ellipsis: true });
    } else {
      doc.font('Helvetica-Bold').fontSize(size).text(value, x, y, { width: columnWidth, lineBreak: false });
    }
  });

  doc
    .font('Helvetica-Bold')
    .fontSize(compact ? 11 : 13)
    .text(bag.netLabel, left, bottom - (compact ? 22 : 28), line);
  doc
    .font('Helvetica')
    .fontSize(compact ? 6.5 : 7)
    .fillColor('#444444')
    .text(`Order ${orderReference(order.orderId)} · bag ${bag.bagNumber} of ${order.bags.length} · ${printable(order.customerName)}`, left, bottom - 8, line);
}

/**
 * Every bag of the day's Pack List as a label on the chosen stock: one 4 × 3 in label a page for a
 * label printer, or sheets of ten for an office printer. Black on white so any printer reproduces it;
 * the fonts are the PDF standard fonts that ship inside pdfkit.
 */
export function renderLabelsPdf(input: { maker: LabelMaker; date: string; orders: readonly PackOrder[]; stock: LabelStock }): Promise<Buffer> {
  const { maker, stock } = input;
  const doc = new PDFDocument({
    autoFirstPage: false,
    info: { Title: `${printable(maker.shopName)} bag labels for ${input.date}`, Author: printable(maker.shopName) },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const newSheet = () => doc.addPage({ size: [stock.page.width, stock.page.height], margin: 0 });
  const bags = input.orders.flatMap((order) => order.bags.map((bag) => ({ order, bag })));
  let sheet = -1;
  bags.forEach(({ order, bag }, index) => {
    const slot = labelSlot(stock, index);
    if (slot.sheet !== sheet) {
      newSheet();
      sheet = slot.sheet;
    }
    drawLabel(doc, { x: slot.x, y: slot.y, ...stock.label }, maker, order, bag);
  });
  if (bags.length === 0) {
    newSheet();
    doc
      .font('Helvetica')
      .fontSize(10)
      .text(`No bags ship on ${formatDay(input.date)}.`, MARGIN, MARGIN, { width: stock.label.width - 2 * MARGIN });
  }
  doc.end();
  return done;
}
