import type { Response } from 'express';

/**
 * Answers with a file to save: Content-Disposition `attachment` with an RFC 6266 file name, the type
 * from the name's extension, and never cached (exports hold staff data).
 */
export function sendDownload(res: Response, fileName: string, body: string | Buffer): void {
  res.attachment(fileName);
  res.setHeader('Cache-Control', 'no-store');
  res.send(body);
}
