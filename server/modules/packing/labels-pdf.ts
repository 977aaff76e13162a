import PDFDocument from 'pdfkit';
import { grindLabels, roastLevelLabels } from '@shared/domain/vocabulary';
import type { PackBag, PackOrder } from '@shared/schemas/packing';
import { orderReference } from '../../../shared/domain/order-reference';

/** 4 × 3 in, a common size of bag-label stock for desktop label printers (common practice). */
const LABEL_WIDTH = 4 * 72;
const LABEL_HEIGHT = 3 * 72;
const MARGIN = 14;
const CONTENT_WIDTH = LABEL_WIDTH - 2 * MARGIN;

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

function drawLabel(doc: PDFKit.PDFDocument, shopName: string, order: PackOrder, bag: PackBag) {
  doc.addPage({ size: [LABEL_WIDTH, LABEL_HEIGHT], margin: MARGIN });
  doc
    .font('Helvetica-Bold')
    .fontSize(8)
    .fillColor('black')
    .text(printable(shopName.toUpperCase()), MARGIN, MARGIN, { width: CONTENT_WIDTH, characterSpacing: 0.8, lineBreak: false, ellipsis: true });
  doc
    .font('Helvetica-Bold')
    .fontSize(15)
    .text(printable(bag.coffee), MARGIN, MARGIN + 14, { width: CONTENT_WIDTH, height: 19, ellipsis: true });
  doc
    .font('Helvetica')
    .fontSize(9)
    .text(bag.lotCode ? `Lot ${printable(bag.lotCode)}` : 'Lot to be picked', MARGIN, MARGIN + 34, { width: CONTENT_WIDTH, lineBreak: false });

  let y = MARGIN + 52;
  for (const [label, value] of factsOf(bag)) {
    if (label) {
      doc.font('Helvetica').fontSize(9).text(`${label}:`, MARGIN, y, { width: 70, lineBreak: false });
      doc.font('Helvetica-Bold').text(value, MARGIN + 72, y, { width: CONTENT_WIDTH - 72, lineBreak: false, ellipsis: true });
    } else {
      doc.font('Helvetica-Bold').fontSize(9).text(value, MARGIN, y, { width: CONTENT_WIDTH, lineBreak: false });
    }
    y += 13;
  }

  doc
    .font('Helvetica-Bold')
    .fontSize(13)
    .text(bag.netLabel, MARGIN, LABEL_HEIGHT - MARGIN - 30, { width: CONTENT_WIDTH, lineBreak: false });
  const bagCount = order.bags.length;
  doc
    .font('Helvetica')
    .fontSize(7)
    .fillColor('#444444')
    .text(
      `Order ${orderReference(order.orderId)} · bag ${bag.bagNumber} of ${bagCount} · ${printable(order.customerName)}`,
      MARGIN,
      LABEL_HEIGHT - MARGIN - 9,
      {
        width: CONTENT_WIDTH,
        lineBreak: false,
        ellipsis: true,
      },
    );
}

/**
 * Every bag of the day's Pack List as one 4 × 3 in label page, black on white so any label
 * printer reproduces it. Fonts are the PDF standard fonts that ship inside pdfkit.
 */
export function renderLabelsPdf(input: { shopName: string; date: string; orders: readonly PackOrder[] }): Promise<Buffer> {
  const doc = new PDFDocument({
    autoFirstPage: false,
    info: { Title: `${printable(input.shopName)} bag labels for ${input.date}`, Author: printable(input.shopName) },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  for (const order of input.orders) for (const bag of order.bags) drawLabel(doc, input.shopName, order, bag);
  if (input.orders.every((order) => order.bags.length === 0)) {
    doc.addPage({ size: [LABEL_WIDTH, LABEL_HEIGHT], margin: MARGIN });
    doc
      .font('Helvetica')
      .fontSize(10)
      .text(`No bags ship on ${formatDay(input.date)}.`, MARGIN, MARGIN, { width: CONTENT_WIDTH });
  }
  doc.end();
  return done;
}
