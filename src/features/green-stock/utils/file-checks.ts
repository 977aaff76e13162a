/** What each kind of lot file may be: the server checks the bytes again, this only saves a wasted upload. */
export const lotFileRules = {
  photo: {
    types: ['image/jpeg', 'image/png', 'image/webp'],
    extensions: ['.jpg', '.jpeg', '.png', '.webp'],
    maxBytes: 5 * 1024 * 1024,
    described: 'a JPEG, PNG or WebP image',
  },
  specSheet: { types: ['application/pdf'], extensions: ['.pdf'], maxBytes: 10 * 1024 * 1024, described: 'a PDF' },
} as const;
export type LotFileKind = keyof typeof lotFileRules;

const sizeFormat = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });

/** 2_400_000 → "2.3 MB"; 84_000 → "82 KB" */
export function formatFileSize(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${sizeFormat.format(bytes / (1024 * 1024))} MB`;
  return `${sizeFormat.format(Math.max(1, Math.round(bytes / 1024)))} KB`;
}

/** Why `file` cannot be sent as `kind`, or undefined when it may be. */
export function fileProblem(file: File, kind: LotFileKind): string | undefined {
  const rule = lotFileRules[kind];
  const name = file.name.toLowerCase();
  const typeKnown = file.type !== '';
  const typeFits = typeKnown ? (rule.types as readonly string[]).includes(file.type) : rule.extensions.some((extension) => name.endsWith(extension));
  if (!typeFits) return `${file.name} is not ${rule.described}.`;
  if (file.size > rule.maxBytes) return `${file.name} is ${formatFileSize(file.size)}; the limit is ${formatFileSize(rule.maxBytes)}.`;
  if (file.size === 0) return `${file.name} is empty.`;
  return undefined;
}
