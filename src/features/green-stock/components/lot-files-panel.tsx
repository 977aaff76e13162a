import clsx from 'clsx';
import { FileText, Trash2, Upload } from 'lucide-react';
import { useId, useRef, useState, type ChangeEvent } from 'react';
import type { LotDetail } from '@shared/schemas/lots';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { ApiError } from '@/lib/api-client';
import { photoIdOf, useDeleteLotPhoto, useUploadLotPhoto, useUploadSpecSheet } from '../api/lot-files';
import { fileProblem, formatFileSize, lotFileRules, type LotFileKind } from '../utils/file-checks';

const failureText = (error: unknown) => (error instanceof ApiError ? error.message : 'The upload did not go through. Please try again.');

/**
 * A file picker that checks type and size before sending, then shows what the server said. The
 * result is tied to the picker, so it is read out with it.
 */
function FilePicker({ kind, label, onFile }: { kind: LotFileKind; label: string; onFile: (file: File) => Promise<string> }) {
  const id = useId();
  const [result, setResult] = useState<{ ok: boolean; text: string }>();
  const [busy, setBusy] = useState(false);
  const rule = lotFileRules[kind];

  async function choose(event: ChangeEvent<HTMLInputElement>) {
    const input = event.currentTarget;
    const file = input.files?.[0];
    if (!file) return;
    const problem = fileProblem(file, kind);
    if (problem) {
      setResult({ ok: false, text: problem });
      input.value = '';
      return;
    }
    setBusy(true);
    setResult(undefined);
    try {
      setResult({ ok: true, text: await onFile(file) });
    } catch (error) {
      setResult({ ok: false, text: failureText(error) });
    } finally {
      setBusy(false);
      input.value = '';
    }
  }

  return (
    <div>
      <label
        htmlFor={id}
        className={clsx(
          'inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-control border border-rule-strong bg-sheet px-4 py-2 font-semibold hover:bg-paper-shade',
          'has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-focus',
          busy && 'cursor-wait opacity-60',
        )}
      >
        <Upload aria-hidden="true" className="size-4" />
        {busy ? 'Uploading…' : label}
        <input
          id={id}
          type="file"
          accept={[...rule.types, ...rule.extensions].join(',')}
          disabled={busy}
          aria-describedby={`${id}-rule${result ? ` ${id}-result` : ''}`}
          aria-invalid={result && !result.ok ? true : undefined}
          onChange={(event) => void choose(event)}
          className="sr-only"
        />
      </label>
      <p id={`${id}-rule`} className="mt-1 text-small text-ink-muted">
        {rule.described[0]?.toUpperCase()}
        {rule.described.slice(1)}, up to {formatFileSize(rule.maxBytes)}.
      </p>
      {result ? (
        <p id={`${id}-result`} role={result.ok ? 'status' : 'alert'} className={clsx('mt-1 text-small font-semibold', result.ok ? 'text-ok' : 'text-alert')}>
          {result.text}
        </p>
      ) : null}
    </div>
  );
}

/** The lot's photos (add, delete) and its spec sheet (upload or replace). */
export function LotFilesPanel({ lot }: { lot: LotDetail }) {
  const uploadPhoto = useUploadLotPhoto();
  const deletePhoto = useDeleteLotPhoto();
  const uploadSpecSheet = useUploadSpecSheet();
  const [deleteFailure, setDeleteFailure] = useState<string>();
  const photosHeading = useRef<HTMLHeadingElement>(null);

  async function remove(url: string, position: number) {
    setDeleteFailure(undefined);
    try {
      await deletePhoto.mutateAsync({ code: lot.code, photoId: photoIdOf(url) });
      // The button is gone with its photo; keep the keyboard in the same place.
      photosHeading.current?.focus();
    } catch (error) {
      setDeleteFailure(`Photo ${position} was not deleted: ${failureText(error)}`);
    }
  }

  return (
    <div className="grid gap-6 md:grid-cols-2">
      <section aria-labelledby="lot-photos" className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-4 sm:p-5">
        <h3 id="lot-photos" ref={photosHeading} tabIndex={-1} className="text-h3 outline-none">
          Photos
        </h3>
        {deleteFailure ? <FormAlert>{deleteFailure}</FormAlert> : null}
        {lot.photos.length === 0 ? (
          <p className="text-small text-ink-muted">No photos yet. The first photo is the one Green Lots shows on the lot’s card.</p>
        ) : (
          <ul aria-label="Photos of this lot" className="grid grid-cols-2 gap-3">
            {lot.photos.map((url, index) => (
              <li key={url} className="grid gap-2">
                <img
                  src={url}
                  alt={`Photo ${index + 1} of ${lot.name}`}
                  width={320}
                  height={240}
                  className="aspect-[4/3] w-full rounded-control bg-paper-shade object-cover"
                />
                <Button variant="secondary" disabled={deletePhoto.isPending} onClick={() => void remove(url, index + 1)}>
                  <Trash2 aria-hidden="true" className="size-4" />
                  Delete photo {index + 1}
                </Button>
              </li>
            ))}
          </ul>
        )}
        <FilePicker
          kind="photo"
          label="Add a photo"
          onFile={async (file) => {
            const stored = await uploadPhoto.mutateAsync({ code: lot.code, file });
            return `Photo added (${formatFileSize(stored.byteSize)}).`;
          }}
        />
      </section>

      <section aria-labelledby="lot-spec-sheet" className="grid content-start gap-3 rounded-card border border-rule bg-sheet p-4 sm:p-5">
        <h3 id="lot-spec-sheet" className="text-h3">
          Spec sheet
        </h3>
        {lot.specSheetUrl ? (
          <p>
            <a href={lot.specSheetUrl} className="inline-flex items-center gap-1.5 font-semibold text-leaf underline">
              <FileText aria-hidden="true" className="size-4" />
              Download the current spec sheet
            </a>
          </p>
        ) : (
          <p className="text-small text-ink-muted">No spec sheet yet. Home roasters can download it from the lot page.</p>
        )}
        <FilePicker
          kind="specSheet"
          label={lot.specSheetUrl ? 'Replace the spec sheet' : 'Upload a spec sheet'}
          onFile={async (file) => {
            const stored = await uploadSpecSheet.mutateAsync({ code: lot.code, file });
            return `Spec sheet uploaded (${formatFileSize(stored.byteSize)}).`;
          }}
        />
      </section>
    </div>
  );
}
