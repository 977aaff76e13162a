/** File types Restday accepts, recognised by their first bytes (never by name or the client's claimed type). */
export const fileSignatures = {
  jpeg: { contentType: 'image/jpeg', extension: 'jpg' },
  png: { contentType: 'image/png', extension: 'png' },
  webp: { contentType: 'image/webp', extension: 'webp' },
  pdf: { contentType: 'application/pdf', extension: 'pdf' },
} as const;

export type FileType = keyof typeof fileSignatures;

function startsWith(bytes: Uint8Array, signature: readonly number[], offset = 0): boolean {
  if (bytes.length < offset + signature.length) return false;
  return signature.every((byte, index) => bytes[offset + index] === byte);
}

const ascii = (text: string) => [...text].map((character) => character.charCodeAt(0));

/**
 * The type the content really has: JPEG (FF D8 FF), PNG (89 50 4E 47 0D 0A 1A 0A), WebP ("RIFF",
 * four size bytes, "WEBP") or PDF ("%PDF-"); undefined for anything else.
 */
export function detectFileType(bytes: Uint8Array): FileType | undefined {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'jpeg';
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'png';
  if (startsWith(bytes, ascii('RIFF')) && startsWith(bytes, ascii('WEBP'), 8)) return 'webp';
  if (startsWith(bytes, ascii('%PDF-'))) return 'pdf';
  return undefined;
}
