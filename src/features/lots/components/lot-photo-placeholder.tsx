import clsx from 'clsx';

// A drawn stand-in for a lot photo: contour lines (a nod to altitude) around the origin's initials.
// The drawing is decided by the origin's name, so the same origin always looks the same.

const tones = [
  { surface: 'bg-leaf-wash', ink: 'text-leaf' },
  { surface: 'bg-ember-wash', ink: 'text-ember' },
  { surface: 'bg-caution-wash', ink: 'text-caution' },
  { surface: 'bg-paper-shade', ink: 'text-ink-muted' },
] as const;

function hashOf(text: string): number {
  let hash = 7;
  for (const char of text) hash = (hash * 31 + (char.codePointAt(0) ?? 0)) >>> 0;
  return hash;
}

/** "Costa Rica" → "CR"; "Kenya" → "Ke" */
export function originInitials(origin: string): string {
  const words = origin.trim().split(/\s+/).filter(Boolean);
  const [first = '', second] = words;
  if (second) return `${first.charAt(0)}${second.charAt(0)}`.toUpperCase();
  return `${first.charAt(0).toUpperCase()}${first.charAt(1).toLowerCase()}`;
}

const contourRadii = [28, 56, 84, 112, 140, 168, 196, 224, 252];

export function LotPhotoPlaceholder({ origin, className }: { origin: string; className?: string }) {
  const hash = hashOf(origin);
  const tone = tones[hash % tones.length] ?? tones[0];
  const cx = 150 + (hash % 200);
  const cy = 60 + ((hash >>> 8) % 140);
  const tilt = ((hash >>> 16) % 50) - 25;

  return (
    <svg
      viewBox="0 0 400 300"
      preserveAspectRatio="xMidYMid slice"
      aria-hidden="true"
      focusable="false"
      className={clsx('block size-full', tone.surface, tone.ink, className)}
    >
      <g fill="none" stroke="currentColor" strokeOpacity="0.28" strokeWidth="1.5" transform={`rotate(${tilt} ${cx} ${cy})`}>
        {contourRadii.map((radius, index) => (
          <ellipse key={radius} cx={cx + index * 3} cy={cy - index * 2} rx={radius * 1.35} ry={radius} />
        ))}
      </g>
      <text x="28" y="268" fill="currentColor" fontSize="84" className="font-heading font-semibold">
        {originInitials(origin)}
      </text>
    </svg>
  );
}
