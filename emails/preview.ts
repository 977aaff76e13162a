// `npm run emails:preview [folder]`: renders every template with the demo payloads into a folder
// (default .data/email-preview): <template>.html, <template>.txt, and an index.html linking them.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { demoEmailContext, demoEmailPayloads } from './demo';
import { escapeHtml } from './parts/escape';
import { emailTemplateNames } from './payloads';
import { renderEmail } from './render';

const folder = path.resolve(process.argv[2] ?? '.data/email-preview');
mkdirSync(folder, { recursive: true });

const entries = emailTemplateNames.map((template) => {
  const email = renderEmail(template, demoEmailPayloads[template], demoEmailContext);
  writeFileSync(path.join(folder, `${template}.html`), email.html);
  writeFileSync(path.join(folder, `${template}.txt`), `Subject: ${email.subject}\n\n${email.text}`);
  return { template, subject: email.subject };
});

writeFileSync(
  path.join(folder, 'index.html'),
  `<!doctype html><meta charset="utf-8"><title>Restday e-mail previews</title>` +
    `<body style="font-family:system-ui,sans-serif;max-width:40rem;margin:2rem auto;line-height:1.6">` +
    `<h1>Restday e-mail previews</h1><p>Rendered with invented demo data.</p><ul>` +
    entries
      .map(
        ({ template, subject }) =>
          `<li><a href="${template}.html">${escapeHtml(template)}</a> (<a href="${template}.txt">text</a>): ${escapeHtml(subject)}</li>`,
      )
      .join('') +
    `</ul></body>`,
);
process.stdout.write(`Wrote ${entries.length} e-mail previews to ${folder}/index.html\n`);
