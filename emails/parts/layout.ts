import { escapeHtml, safeHref } from './escape';

/**
 * Templates describe a message as blocks of plain strings; this file alone turns them into HTML
 * (escaping every string) and into the plain-text part. A template therefore cannot forget to
 * escape a customer's name or a lot's note: it never writes markup.
 */
export type Block =
  | { kind: 'paragraph'; text: string }
  | { kind: 'button'; label: string; url: string }
  /** Label/value pairs: "Roast date — Thursday, December 3". */
  | { kind: 'facts'; rows: [label: string, value: string][] }
  /** Order lines with optional amounts, and totals under them. */
  | { kind: 'lines'; rows: { description: string; detail: string; amount?: string }[]; totals?: [label: string, value: string][] }
  | { kind: 'address'; title: string; lines: string[] }
  /** Smaller, quieter text (a safety note, why they got this e-mail). */
  | { kind: 'note'; text: string };

export interface EmailContent {
  subject: string;
  /** The line mail apps show after the subject. */
  preheader: string;
  heading: string;
  blocks: Block[];
}

export interface EmailContext {
  shop: {
    name: string;
    /** One line or several (separated by newlines), e.g. "12 Old Mill Way, Wrenfield, CO 81640". */
    postalAddress: string;
  };
  /** Absolute base of links back to the shop, e.g. https://shop.example.com (no trailing slash). */
  baseUrl: string;
  /** IANA zone instants are shown in, e.g. America/Denver. */
  timeZone: string;
}

export interface RenderedEmail {
  subject: string;
  html: string;
  text: string;
}

// Restday's palette (src/index.css): paper, sheet, ink, leaf. System fonts only: no web fonts or
// images are fetched from anywhere.
const color = {
  paper: '#f7f2ea',
  sheet: '#fffdf8',
  ink: '#2b2521',
  muted: '#5e544c',
  rule: '#d9cdbb',
  leaf: '#2f5d50',
  wash: '#e3ede8',
};
const serif = "Georgia, 'Iowan Old Style', 'Times New Roman', serif";
const sans = "'Segoe UI', system-ui, -apple-system, Helvetica, Arial, sans-serif";

function addressLines(postalAddress: string): string[] {
  return postalAddress
    .split(/\r?\n|\\n/)
    .map((line) => line.trim())
    .filter(Boolean);
}

function blockHtml(block: Block): string {
  switch (block.kind) {
    case 'paragraph':
      return `<p style="margin:0 0 16px;font-size:16px;line-height:1.6;color:${color.ink};">${escapeHtml(block.text)}</p>`;
    case 'note':
      return `<p style="margin:0 0 16px;font-size:14px;line-height:1.5;color:${color.muted};">${escapeHtml(block.text)}</p>`;
    case 'button':
      return (
        `<table role="presentation" cellpadding="0" cellspacing="0" style="margin:8px 0 24px;"><tr>` +
        `<td style="border-radius:6px;background:${color.leaf};">` +
        `<a href="${safeHref(block.url)}" style="display:inline-block;padding:12px 22px;font-family:${sans};font-size:16px;font-weight:600;color:#ffffff;text-decoration:none;border-radius:6px;">${escapeHtml(block.label)}</a>` +
        `</td></tr></table>` +
        `<p style="margin:0 0 16px;font-size:13px;line-height:1.5;color:${color.muted};word-break:break-all;">If the button does not work, paste this address into your browser: ${escapeHtml(block.url)}</p>`
      );
    case 'facts':
      return (
        `<table role="presentation" cellpadding="0" cellspacing="0" width="100%" style="margin:0 0 20px;border-collapse:collapse;">` +
        block.rows
          .map(
            ([label, value]) =>
              `<tr><td style="padding:6px 12px 6px 0;border-bottom:1px solid ${color.rule};font-size:14px;color:${color.muted};vertical-align:top;white-space:nowrap;">${escapeHtml(label)}</td>` +
              `<td style="padding:6px 0;border-bottom:1px solid ${color.rule};font-size:15px;color:${color.ink};">${escapeHtml(value)}</td></tr>`,
          )
          .join('') +
        `</table>`
      );
    case 'lines': {
      const rows = block.rows
        .map(
          (row) =>
            `<tr><td style="padding:8px 12px 8px 0;border-bottom:1px solid ${color.rule};font-size:15px;color:${color.ink};">${escapeHtml(row.description)}` +
            `<br><span style="font-size:13px;color:${color.muted};">${escapeHtml(row.detail)}</span></td>` +
            `<td align="right" style="padding:8px 0;border-bottom:1px solid ${color.rule};font-size:15px;color:${color.ink};white-space:nowrap;vertical-align:top;">${escapeHtml(row.amount ?? '')}</td></tr>`,
        )
        .join('');
      const totals = (block.totals ?? [])
        .map(
          ([label, value], index, all) =>
            `<tr><td align="right" style="padding:6px 12px 0 0;font-size:14px;color:${color.muted};">${escapeHtml(label)}</td>` +
            `<td align="right" style="padding:6px 0 0;font-size:15px;color:${color.ink};white-space:nowrap;${index === all.length - 1 ? 'font-weight:700;' : ''}">${escapeHtml(value)}</td></tr>`,
        )
        .join('');
      return `<table role="presentation" cellpadding="0" cellspacing="0" width="100%" style="margin:0 0 20px;border-collapse:collapse;">${rows}${totals}</table>`;
    }
    case 'address':
      return (
        `<p style="margin:0 0 4px;font-size:14px;color:${color.muted};">${escapeHtml(block.title)}</p>` +
        `<p style="margin:0 0 20px;font-size:15px;line-height:1.5;color:${color.ink};">${block.lines.map(escapeHtml).join('<br>')}</p>`
      );
  }
}

function blockText(block: Block): string {
  switch (block.kind) {
    case 'paragraph':
    case 'note':
      return block.text;
    case 'button':
      return `${block.label}:\n${block.url}`;
    case 'facts':
      return block.rows.map(([label, value]) => `${label}: ${value}`).join('\n');
    case 'lines': {
      const rows = block.rows.map((row) => `- ${row.description}: ${row.detail}${row.amount ? ` — ${row.amount}` : ''}`);
      const totals = (block.totals ?? []).map(([label, value]) => `${label}: ${value}`);
      return [...rows, ...(totals.length ? ['', ...totals] : [])].join('\n');
    }
    case 'address':
      return [`${block.title}`, ...block.lines].join('\n');
  }
}

function footerText(context: EmailContext): string {
  return [context.shop.name, ...addressLines(context.shop.postalAddress)].join('\n');
}

/** The whole message: Restday's calm layout around the blocks, the shop's postal address below. */
export function layout(content: EmailContent, context: EmailContext): RenderedEmail {
  const shopName = escapeHtml(context.shop.name);
  const address = addressLines(context.shop.postalAddress).map(escapeHtml).join('<br>');
  const html =
    `<!doctype html><html lang="en"><head><meta charset="utf-8">` +
    `<meta name="viewport" content="width=device-width, initial-scale=1"><meta name="color-scheme" content="light">` +
    `<title>${escapeHtml(content.subject)}</title></head>` +
    `<body style="margin:0;padding:0;background:${color.paper};font-family:${sans};color:${color.ink};">` +
    `<div style="display:none;max-height:0;overflow:hidden;opacity:0;">${escapeHtml(content.preheader)}</div>` +
    `<table role="presentation" cellpadding="0" cellspacing="0" width="100%" style="background:${color.paper};"><tr><td align="center" style="padding:32px 16px;">` +
    `<table role="presentation" cellpadding="0" cellspacing="0" width="100%" style="max-width:560px;">` +
    `<tr><td style="padding:0 4px 16px;font-family:${serif};font-size:20px;color:${color.leaf};letter-spacing:0.02em;">${shopName}</td></tr>` +
    `<tr><td style="background:${color.sheet};border:1px solid ${color.rule};border-radius:8px;padding:32px 28px;font-family:${sans};">` +
    `<h1 style="margin:0 0 20px;font-family:${serif};font-size:24px;line-height:1.3;font-weight:600;color:${color.ink};">${escapeHtml(content.heading)}</h1>` +
    content.blocks.map(blockHtml).join('') +
    `</td></tr>` +
    `<tr><td style="padding:20px 4px 0;font-size:13px;line-height:1.5;color:${color.muted};">` +
    `<p style="margin:0 0 6px;">${shopName}<br>${address}</p>` +
    `<p style="margin:0;">You are receiving this e-mail about your account or an order with ${shopName}.</p>` +
    `</td></tr></table></td></tr></table></body></html>`;

  const text = [
    content.heading,
    '',
    ...content.blocks.flatMap((block) => [blockText(block), '']),
    '--',
    footerText(context),
    `You are receiving this e-mail about your account or an order with ${context.shop.name}.`,
    '',
  ].join('\n');
  return { subject: content.subject, html, text };
}
