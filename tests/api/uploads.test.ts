import { randomUUID } from 'node:crypto';
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { lotDetailSchema, lotFileSchema } from '@shared/schemas/lots';
import { uploads } from '../../server/db/schema/index';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { signedInAgent } from '../setup/test-users';
import { createTestUser } from '../factories/index';

const tag = randomUUID().slice(0, 6).toUpperCase();
const code = `${tag}-FILES`;
const MB = 1024 * 1024;
let uploadsRoot: string;
let uploadsDir: string;
let app: ReturnType<typeof createTestApp>;
let staff: Awaited<ReturnType<typeof signedInAgent>>;

// Smallest well-formed headers of each type, padded with bytes: only the signature is read.
const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from('JFIF invented photo')]);
const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(24, 1)]);
const webp = Buffer.concat([Buffer.from('RIFF'), Buffer.from([0x1c, 0, 0, 0]), Buffer.from('WEBPVP8 '), Buffer.alloc(16, 2)]);
const pdf = Buffer.from('%PDF-1.7\n% invented spec sheet\n%%EOF\n');

beforeAll(async () => {
  uploadsRoot = await mkdtemp(path.join(tmpdir(), 'restday-uploads-'));
  // Inside a dot folder, as the default UPLOADS_DIR (.data/uploads) is under `npm start`.
  uploadsDir = path.join(uploadsRoot, '.data', 'uploads');
  app = createTestApp({ env: { UPLOADS_DIR: uploadsDir } });
  staff = await signedInAgent(app, await createTestUser('staff'));
  const created = await staff.post('/api/lots').send({
    code,
    name: 'Invented Terrace Natural',
    origin: 'Testland',
    region: 'Low Terrace',
    producer: 'Invented Smallholders',
    variety: 'Typica',
    process: 'natural',
    altitudeM: 1600,
    cropYear: 2026,
    moisturePct: 11,
    suggestedLevel: 'medium',
    allowedLevels: ['medium'],
    pricePerKgCents: 2200,
  });
  expect(created.status).toBe(201);
});

afterAll(async () => {
  await rm(uploadsRoot, { recursive: true, force: true });
});

async function uploadPhoto(bytes: Buffer, name: string) {
  return staff.post(`/api/lots/${code}/photos`).attach('file', bytes, name);
}

describe('POST /api/lots/:code/photos', () => {
  it('stores JPEG, PNG and WebP under server-made names and lists them on the lot in order', async () => {
    const made = [];
    for (const [bytes, name, type] of [
      [jpeg, '../../etc/passwd.jpg', 'image/jpeg'],
      [png, 'beans.png', 'image/png'],
      [webp, 'sack.webp', 'image/webp'],
    ] as const) {
      const response = await uploadPhoto(bytes, name);
      expect(response.status).toBe(201);
      const file = lotFileSchema.parse(response.body);
      expect(file).toMatchObject({ kind: 'photo', contentType: type, byteSize: bytes.length, url: `/api/uploads/${file.id}` });
      made.push(file);
    }
    const stored = await readdir(uploadsDir);
    expect(stored).toHaveLength(3);
    for (const name of stored) expect(name).toMatch(/^[0-9a-f-]{36}\.(jpg|png|webp)$/);
    const [row] = await getTestDb().select().from(uploads).where(eq(uploads.id, made[0]!.id));
    expect(row).toMatchObject({ originalName: 'passwd.jpg', contentType: 'image/jpeg' });
    expect(await readFile(path.join(uploadsDir, row!.storageKey))).toEqual(jpeg);

    const lot = lotDetailSchema.parse((await request(app).get(`/api/lots/${code}`)).body);
    expect(lot.photos).toEqual(made.map((file) => file.url));
  });

  it('refuses a PDF named .jpg and a text file claiming to be a PNG, by content, storing nothing', async () => {
    const before = await readdir(uploadsDir);
    const renamedPdf = await staff.post(`/api/lots/${code}/photos`).attach('file', pdf, { filename: 'photo.jpg', contentType: 'image/jpeg' });
    expect(renamedPdf.status).toBe(415);
    expect(apiErrorSchema.parse(renamedPdf.body).error).toMatchObject({ code: 'unsupported_file_type', fields: { file: expect.any(String) } });
    const script = await uploadPhoto(Buffer.from('<svg onload="alert(1)"/>'), 'image.png');
    expect(script.status).toBe(415);
    expect(await readdir(uploadsDir)).toEqual(before);
  });

  it('answers 413 for an image over 5 MB and 400 without a file', async () => {
    const large = Buffer.concat([jpeg, Buffer.alloc(5 * MB)]);
    const response = await uploadPhoto(large, 'large.jpg');
    expect(response.status).toBe(413);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('file_too_large');
    const missing = await staff.post(`/api/lots/${code}/photos`).send({});
    expect(missing.status).toBe(400);
    expect(apiErrorSchema.parse(missing.body).error.code).toBe('file_required');
    const otherField = await staff.post(`/api/lots/${code}/photos`).attach('image', jpeg, 'a.jpg');
    expect(otherField.status).toBe(400);
    expect(apiErrorSchema.parse(otherField.body).error.code).toBe('invalid_upload');
  });

  it('answers 404 for an unknown lot', async () => {
    expect((await staff.post(`/api/lots/${tag}-NOPE/photos`).attach('file', jpeg, 'a.jpg')).status).toBe(404);
  });
});

describe('POST /api/lots/:code/spec-sheet', () => {
  it('refuses a PNG named .pdf by its content', async () => {
    const response = await staff.post(`/api/lots/${code}/spec-sheet`).attach('file', png, { filename: 'spec.pdf', contentType: 'application/pdf' });
    expect(response.status).toBe(415);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('unsupported_file_type');
  });

  it('answers 413 for a PDF over 10 MB', async () => {
    const response = await staff.post(`/api/lots/${code}/spec-sheet`).attach('file', Buffer.concat([pdf, Buffer.alloc(10 * MB)]), 'big.pdf');
    expect(response.status).toBe(413);
  });

  it('keeps one spec sheet per lot: a new one replaces the old row and file', async () => {
    const first = lotFileSchema.parse((await staff.post(`/api/lots/${code}/spec-sheet`).attach('file', pdf, 'first.pdf')).body);
    const second = await staff.post(`/api/lots/${code}/spec-sheet`).attach('file', pdf, 'Lot spec "final"; v2.pdf');
    expect(second.status).toBe(201);
    const file = lotFileSchema.parse(second.body);
    expect((await request(app).get(first.url)).status).toBe(404);
    const lot = lotDetailSchema.parse((await request(app).get(`/api/lots/${code}`)).body);
    expect(lot.specSheetUrl).toBe(file.url);
    expect((await readdir(uploadsDir)).filter((name) => name.endsWith('.pdf'))).toHaveLength(1);
  });
});

describe('GET /api/uploads/:id', () => {
  it('serves an image inline with its recorded type, nosniff and a long cache', async () => {
    const photo = lotFileSchema.parse((await uploadPhoto(png, 'served.png')).body);
    const response = await request(app).get(photo.url).buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('image/png');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-disposition']).toBe('inline');
    expect(response.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Buffer.from(response.body as Buffer)).toEqual(png);
  });

  it('serves a spec sheet as an attachment with a safe file name', async () => {
    const lot = lotDetailSchema.parse((await request(app).get(`/api/lots/${code}`)).body);
    const response = await request(app).get(lot.specSheetUrl!).buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-disposition']).toBe('attachment; filename="Lot spec final v2.pdf"');
  });

  it('never lets a stored name break out of the Content-Disposition header', async () => {
    const storageKey = `${randomUUID()}.pdf`;
    await writeFile(path.join(uploadsDir, storageKey), pdf);
    const [row] = await getTestDb()
      .insert(uploads)
      .values({ kind: 'spec_sheet', storageKey, contentType: 'application/pdf', byteSize: pdf.length, originalName: '../a"b;\\x\u00e9.exe' })
      .returning({ id: uploads.id });
    const response = await request(app).get(`/api/uploads/${row!.id}`);
    expect(response.status).toBe(200);
    expect(response.headers['content-disposition']).toBe('attachment; filename=_a_b__x_.exe.pdf');
  });

  it('answers 404 as JSON for unknown and malformed ids', async () => {
    for (const id of [randomUUID(), 'not-an-id']) {
      const response = await request(app).get(`/api/uploads/${id}`);
      expect(response.status).toBe(404);
      expect(response.headers['content-type']).toMatch(/^application\/json/);
      expect(apiErrorSchema.parse(response.body).error.code).toBe('upload_not_found');
    }
  });
});

describe('DELETE /api/lots/:code/photos/:id', () => {
  it('removes the photo, its row and its file; a second delete is a 404', async () => {
    const photo = lotFileSchema.parse((await uploadPhoto(webp, 'gone.webp')).body);
    const [row] = await getTestDb().select().from(uploads).where(eq(uploads.id, photo.id));
    expect((await staff.delete(`/api/lots/${code}/photos/${photo.id}`)).status).toBe(204);
    expect(await readdir(uploadsDir)).not.toContain(row!.storageKey);
    expect((await request(app).get(photo.url)).status).toBe(404);
    expect((await staff.delete(`/api/lots/${code}/photos/${photo.id}`)).status).toBe(404);
  });
});
