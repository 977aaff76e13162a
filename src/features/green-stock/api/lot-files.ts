import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { lotFileSchema, type LotDetail, type LotFile } from '@shared/schemas/lots';
import { ApiError, apiRequest } from '@/lib/api-client';
import { getEditableLotQueryOptions } from './get-editable-lot';

const lotPath = (code: string) => `/api/lots/${encodeURIComponent(code)}`;

/**
 * Sends one file as the multipart field `file`. The browser sets the multipart Content-Type with
 * its boundary; the server decides the type from the bytes and answers with the stored file.
 */
async function postFile(path: string, file: File): Promise<LotFile> {
  const body = new FormData();
  body.append('file', file);
  let response: Response;
  try {
    response = await fetch(path, { method: 'POST', body, credentials: 'same-origin', headers: { Accept: 'application/json', 'X-Restday-Client': 'web' } });
  } catch {
    throw new ApiError(0, 'network_error', 'Restday could not be reached. Check your connection and try again.');
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    const failure = apiErrorSchema.safeParse(payload);
    if (failure.success) throw new ApiError(response.status, failure.data.error.code, failure.data.error.message, failure.data.error.fields);
    throw new ApiError(response.status, 'http_error', response.status === 413 ? 'The file is too large.' : 'The upload did not go through.');
  }
  const stored = lotFileSchema.safeParse(payload);
  if (!stored.success) throw new ApiError(response.status, 'invalid_response', 'Restday sent a reply this page does not understand. Reload the page.');
  return stored.data;
}

export function uploadLotPhoto({ code, file }: { code: string; file: File }): Promise<LotFile> {
  return postFile(`${lotPath(code)}/photos`, file);
}

/** A new spec sheet replaces the old one, whose address stops working. */
export function uploadSpecSheet({ code, file }: { code: string; file: File }): Promise<LotFile> {
  return postFile(`${lotPath(code)}/spec-sheet`, file);
}

export async function deleteLotPhoto({ code, photoId }: { code: string; photoId: string }): Promise<void> {
  await apiRequest(`${lotPath(code)}/photos/${encodeURIComponent(photoId)}`, { method: 'DELETE', schema: z.undefined() });
}

/** A photo's upload id, from its address (`/api/uploads/<id>`). */
export function photoIdOf(url: string): string {
  return url.split('/').pop() ?? '';
}

/** Keeps the editor's copy of the lot in step with a change to its files, without asking again. */
function useChangeCachedLot() {
  const queryClient = useQueryClient();
  return (code: string, change: (lot: LotDetail) => LotDetail) =>
    queryClient.setQueryData(getEditableLotQueryOptions(code).queryKey, (lot) => (lot ? change(lot) : lot));
}

export function useUploadLotPhoto() {
  const changeLot = useChangeCachedLot();
  return useMutation({
    mutationFn: uploadLotPhoto,
    onSuccess: (file, { code }) => changeLot(code, (lot) => ({ ...lot, photos: [...lot.photos, file.url] })),
  });
}

export function useUploadSpecSheet() {
  const changeLot = useChangeCachedLot();
  return useMutation({
    mutationFn: uploadSpecSheet,
    onSuccess: (file, { code }) => changeLot(code, (lot) => ({ ...lot, specSheetUrl: file.url })),
  });
}

export function useDeleteLotPhoto() {
  const changeLot = useChangeCachedLot();
  return useMutation({
    mutationFn: deleteLotPhoto,
    onSuccess: (_nothing, { code, photoId }) => changeLot(code, (lot) => ({ ...lot, photos: lot.photos.filter((url) => photoIdOf(url) !== photoId) })),
  });
}
