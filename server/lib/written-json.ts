import { createHash } from 'node:crypto';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';

/** A JSON answer written once and sent many times: its bytes, compressed copies and ETag. */
export interface WrittenJson {
  identity: Buffer;
  br: Buffer;
  gzip: Buffer;
  etag: string;
}

export function writtenJson(value: unknown): WrittenJson {
  const identity = Buffer.from(JSON.stringify(value));
  return {
    identity,
    // A middling brotli level: the copy is made on every change of the list, on the request path.
    br: brotliCompressSync(identity, { params: { [constants.BROTLI_PARAM_QUALITY]: 6 } }),
    gzip: gzipSync(identity),
    etag: `"${createHash('sha1').update(identity).digest('base64url')}"`,
  };
}

/** Sends a written answer in the encoding the client accepts; the app's compression passes it by. */
export function sendWrittenJson(req: Request, res: Response, written: WrittenJson) {
  res.setHeader('ETag', written.etag);
  res.setHeader('Vary', 'Accept-Encoding');
  res.type('json');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  const encoding = req.acceptsEncodings('br', 'gzip', 'identity');
  if (encoding === 'br' || encoding === 'gzip') res.setHeader('Content-Encoding', encoding);
  res.send(encoding === 'br' ? written.br : encoding === 'gzip' ? written.gzip : written.identity);
}
