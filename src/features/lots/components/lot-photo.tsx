import clsx from 'clsx';
import { LotPhotoPlaceholder } from './lot-photo-placeholder';

/** A lot's photo in a fixed 4:3 frame, so nothing shifts while it loads; a drawn stand-in when there is none. */
export function LotPhoto({ src, alt, origin, dimmed = false }: { src: string | null; alt: string; origin: string; dimmed?: boolean }) {
  return (
    <div className={clsx('aspect-[4/3] overflow-hidden bg-paper-shade', dimmed && 'opacity-60 grayscale')}>
      {src ? (
        <img src={src} alt={alt} width={800} height={600} loading="lazy" decoding="async" className="size-full object-cover" />
      ) : (
        <LotPhotoPlaceholder origin={origin} />
      )}
    </div>
  );
}
