import { stringify } from 'csv-stringify/sync';
import PDFDocument from 'pdfkit';
import { roastLevelLabels } from '@shared/domain/vocabulary';
import { formatShopInstant } from '@shared/domain/shop-clock';
import type { Batch, RoastListResponse } from '@shared/schemas/roastery';

/** The CSV download's columns: one row per lot and level, with its lot's pull-list figures beside it. */
export const roastListCsvColumns = [
  'roast_date',
  'lot_code',
  'lot_name',
  'roast_level',
  'bags',
  'roasted_grams',
  'loss_pct',
  'loss_source',
  'green_grams',
  'batch_count',
  'batch_green_grams',
  'recorded_batches',
  'recorded_green_grams',
  'recorded_roasted_grams',
  'to_roast_roasted_grams',
  'to_roast_green_grams',
  'to_roast_batch_green_grams',
  'lot_pull_green_grams',
  'lot_stock_grams',
  'lot_shortfall_grams',
] as const;

/** A spreadsheet runs a cell starting with = + - @ (or a tab or return) as a formula; a leading ' keeps it text. */
function spreadsheetSafe(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function roastListCsv(list: RoastListResponse): string {
  const pullByLot = new Map(list.pull.map((pull) => [pull.lotCode, pull]));
  const rows = list.lines.map((line) => {
    const pull = pullByLot.get(line.lotCode);
    return {
      roast_date: list.date,
      lot_code: spreadsheetSafe(line.lotCode),
      lot_name: spreadsheetSafe(line.lotName),
      roast_level: line.roastLevel,
      bags: line.bags,
      roasted_grams: line.roastedGrams,
      loss_pct: line.lossPct,
      loss_source: line.lossSource,
      green_grams: line.greenGrams,
      batch_count: line.batches.length,
      // Semicolons, never a leading sign: the cell stays text.
      batch_green_grams: line.batches.map((batch) => batch.greenGrams).join('; '),
      recorded_batches: line.recorded.batches,
      recorded_green_grams: line.recorded.greenGrams,
      recorded_roasted_grams: line.recorded.roastedGrams,
      to_roast_roasted_grams: line.toRoast.roastedGrams,
      to_roast_green_grams: line.toRoast.greenGrams,
      to_roast_batch_green_grams: line.toRoast.batches.map((batch) => batch.greenGrams).join('; '),
      lot_pull_green_grams: pull?.greenGrams ?? 0,
      lot_stock_grams: pull?.stockGrams ?? 0,
      lot_shortfall_grams: pull?.shortfallGrams ?? 0,
    };
  });
  return stringify(rows, { header: true, columns: [...roastListCsvColumns] });
}

export const paperSizes = { letter: 'LETTER', a4: 'A4' } as const;
export type Paper = keyof typeof paperSizes;

/** The safety cautions of commercial roasting (fire, fumes, licensed installation), printed under every Roast List. */
export const roastingCautions = [
  'Chaff fires: chaff builds up in the chaff collector, cooling tray and ducting and burns easily; clear it as the maker and installer direct, and never leave a running roaster unattended.',
  'Carbon monoxide and smoke: the roaster gives off both, and freshly roasted coffee keeps giving off carbon monoxide as it rests; keep the exhaust running and the room ventilated.',
  'Air quality and gas appliances: exhausts, afterburners, gas lines and burners fall under local air-quality, fire and building codes; installing and servicing them is work for licensed installers.',
  'A reminder for the team, not legal or engineering advice: local codes and licensed installers have the final word.',
];

const grams = (value: number) => `${value.toLocaleString('en-US')} g`;

function longDate(isoDate: string): string {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(year, month - 1, day)).toLocaleDateString('en-US', {
    weekday: 'long',
    year: 'numeric',
    month: 'long',
    day: 'numeric',
    timeZone: 'UTC',
  });
}

interface Column {
  title: string;
  /** Share of the text width. */
  width: number;
  align?: 'left' | 'right';
}

/**
 * The Roast List as a black-and-white PDF. Margins of three quarters of an inch and a text width
 * that fits both Letter and A4, so the same layout prints on either.
 */
export function roastListPdf(
  list: RoastListResponse,
  shop: { shopName: string; timeZone: string },
  paper: Paper,
  recordedBatches: readonly Batch[],
): Promise<Buffer> {
  const { shopName } = shop;
  const doc = new PDFDocument({
    size: paperSizes[paper],
    margins: { top: 54, bottom: 54, left: 54, right: 54 },
    info: { Title: `Roast List ${list.date}`, Author: shopName },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  doc.fillColor('black').strokeColor('black');

  function heading(text: string) {
    if (doc.y + 40 > bottom()) doc.addPage();
    doc.moveDown(0.8).font('Helvetica-Bold').fontSize(12).text(text, left, doc.y, { width });
    doc.moveDown(0.3);
  }

  function row(columns: Column[], cells: string[], bold = false) {
    doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(9);
    const heights = columns.map((column, index) => doc.heightOfString(cells[index] ?? '', { width: column.width * width - 6 }));
    const height = Math.max(...heights) + 4;
    if (doc.y + height > bottom()) {
      doc.addPage();
      // A table that runs onto a new page repeats its column titles there.
      if (!bold)
        row(
          columns,
          columns.map((column) => column.title),
          true,
        );
      doc.font('Helvetica').fontSize(9);
    }
    const top = doc.y;
    let x = left;
    columns.forEach((column, index) => {
      doc.text(cells[index] ?? '', x, top + 2, { width: column.width * width - 6, align: column.align ?? 'left' });
      x += column.width * width;
    });
    doc.y = top + height;
    doc
      .moveTo(left, doc.y)
      .lineTo(left + width, doc.y)
      .lineWidth(bold ? 0.8 : 0.3)
      .stroke();
  }

  function table(columns: Column[], rows: string[][]) {
    row(
      columns,
      columns.map((column) => column.title),
      true,
    );
    for (const cells of rows) row(columns, cells);
  }

  doc.font('Helvetica').fontSize(10).text(shopName, left, doc.y, { width });
  doc
    .font('Helvetica-Bold')
    .fontSize(18)
    .text(`Roast List: ${longDate(list.date)}`, { width });
  doc
    .font('Helvetica')
    .fontSize(10)
    .text(
      (list.day.open
        ? `Day capacity ${grams(list.day.capacityGrams)} of green. Planned ${grams(list.totals.greenGrams)} of green in ${list.totals.batches} batches, for ${grams(list.totals.roastedGrams)} roasted.`
        : `This day is closed on the Roast Calendar. Planned ${grams(list.totals.greenGrams)} of green in ${list.totals.batches} batches.`) +
        ` Still to roast: ${grams(list.totals.toRoast.greenGrams)} of green in ${list.totals.toRoast.batches} batches.`,
      { width },
    );

  heading('Roast');
  if (list.lines.length === 0) {
    doc.font('Helvetica').fontSize(10).text('Nothing to roast on this day.', { width });
  } else {
    table(
      [
        { title: 'Lot', width: 0.14 },
        { title: 'Level', width: 0.08 },
        { title: 'Bags', width: 0.05, align: 'right' },
        { title: 'Roasted', width: 0.08, align: 'right' },
        { title: 'Loss', width: 0.08, align: 'right' },
        { title: 'Green', width: 0.08, align: 'right' },
        { title: 'Batches (green each)', width: 0.1 },
        { title: 'Recorded', width: 0.15 },
        { title: 'Still to roast', width: 0.09 },
        { title: 'Actual in / out (write in)', width: 0.15 },
      ],
      list.lines.map((line) => [
        `${line.lotCode}\n${line.lotName}`,
        roastLevelLabels[line.roastLevel],
        String(line.bags),
        grams(line.roastedGrams),
        `${line.lossPct} % (${line.lossSource === 'lot' ? 'lot' : 'level'})`,
        grams(line.greenGrams),
        line.batches.map((batch) => grams(batch.greenGrams)).join(', '),
        line.recorded.batches === 0 ? 'None' : `${line.recorded.batches}: ${grams(line.recorded.greenGrams)} in, ${grams(line.recorded.roastedGrams)} out`,
        line.toRoast.roastedGrams === 0 ? 'Done' : line.toRoast.batches.map((batch) => grams(batch.greenGrams)).join(', '),
        // Room to write each batch's weights by the roaster, one pair of blanks per batch still to roast.
        line.toRoast.batches.map(() => 'in ______ out ______').join('\n\n') || '-',
      ]),
    );
  }

  heading('Batches recorded');
  if (recordedBatches.length === 0) {
    doc.font('Helvetica').fontSize(10).text('No batches recorded for this day yet.', { width });
  } else {
    table(
      [
        { title: 'Recorded', width: 0.15 },
        { title: 'Lot', width: 0.25 },
        { title: 'Level', width: 0.12 },
        { title: 'Green in', width: 0.12, align: 'right' },
        { title: 'Roasted out', width: 0.12, align: 'right' },
        { title: 'Loss', width: 0.1, align: 'right' },
        { title: 'Operator', width: 0.14 },
      ],
      recordedBatches.map((batch) => [
        formatShopInstant(batch.createdAt, shop.timeZone, 'time'),
        `${batch.lotCode}\n${batch.lotName}`,
        roastLevelLabels[batch.roastLevel],
        grams(batch.greenGramsIn),
        grams(batch.roastedGramsOut),
        `${batch.lossPct} %${batch.withinExpected ? '' : ' (outside expected)'}`,
        batch.operatorName ?? '',
      ]),
    );
  }

  heading('Pull list (still to pull)');
  if (list.pull.length > 0) {
    table(
      [
        { title: 'Lot', width: 0.4 },
        { title: 'Pull', width: 0.2, align: 'right' },
        { title: 'In stock', width: 0.2, align: 'right' },
        { title: 'Short', width: 0.2, align: 'right' },
      ],
      list.pull.map((pull) => [
        `${pull.lotCode} ${pull.lotName}`,
        grams(pull.greenGrams),
        grams(pull.stockGrams),
        pull.shortfallGrams > 0 ? grams(pull.shortfallGrams) : '',
      ]),
    );
  } else {
    doc.font('Helvetica').fontSize(10).text('No green to pull.', { width });
  }

  heading('Warnings');
  doc.font('Helvetica').fontSize(10);
  if (list.warnings.length === 0) doc.text('None.', { width });
  for (const warning of list.warnings) doc.text(`- ${warning.message}`, { width });

  heading('Before you start the roaster');
  doc.font('Helvetica').fontSize(8.5);
  for (const caution of roastingCautions) doc.text(caution, { width, paragraphGap: 3 });

  doc.end();
  return done;
}
