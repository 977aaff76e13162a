import { useEffect, useRef, useState } from 'react';

/**
 * A `<dialog>` shown as a modal when it mounts; `finish()` closes it (rather than unmounting it),
 * so the browser gives the focus back to the button that opened it.
 */
export function useOpenDialog() {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [done, setDone] = useState(false);
  useEffect(() => {
    const dialog = dialogRef.current;
    if (dialog && !dialog.open) dialog.showModal();
  }, []);
  useEffect(() => {
    if (done) dialogRef.current?.close();
  }, [done]);
  return { dialogRef, finish: () => setDone(true) };
}
