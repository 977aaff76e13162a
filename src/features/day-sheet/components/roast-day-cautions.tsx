import { ChevronDown, TriangleAlert } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

const READ_KEY = 'restday.roastery.cautions-read';

function wasRead(): boolean {
  try {
    return window.localStorage.getItem(READ_KEY) === 'yes';
  } catch {
    return false;
  }
}

/**
 * The commercial-roasting cautions, where staff start a roast day. Open until someone says they have
 * read them on this browser; after that they start folded, one click away.
 */
export function RoastDayCautions() {
  const [open, setOpen] = useState(() => !wasRead());

  function markRead() {
    try {
      window.localStorage.setItem(READ_KEY, 'yes');
    } catch {
      // Private browsing can refuse storage; the panel then simply opens again next time.
    }
    setOpen(false);
  }

  return (
    <details
      open={open}
      onToggle={(event) => setOpen(event.currentTarget.open)}
      className="mb-8 rounded-card border border-caution/40 bg-caution-wash print:hidden"
    >
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 px-5 py-3 font-heading text-h3 font-semibold text-caution [&::-webkit-details-marker]:hidden">
        <TriangleAlert aria-hidden="true" className="size-5 shrink-0" />
        Safety before you start the roaster
        <ChevronDown aria-hidden="true" className={open ? 'ml-auto size-5 rotate-180' : 'ml-auto size-5'} />
      </summary>
      <div className="px-5 pb-5 text-ink">
        <ul className="list-disc space-y-2 pl-5">
          <li>
            <strong>Chaff fires.</strong> Chaff builds up in the chaff collector, cooling tray and ducting and burns easily. Empty and clean them on the
            schedule your roaster&rsquo;s maker and installer set, and never leave a running roaster unattended.
          </li>
          <li>
            <strong>Carbon monoxide and smoke.</strong> A roaster gives off smoke and carbon monoxide, and freshly roasted coffee keeps giving off carbon
            monoxide as it rests. Keep the exhaust running as installed and the room ventilated.
          </li>
          <li>
            <strong>Air quality and gas appliances.</strong> Exhaust, afterburners, gas lines and burners are governed by local air-quality, fire and building
            codes; installing, venting and servicing them is work for licensed installers.
          </li>
        </ul>
        <p className="mt-3 text-small text-ink-muted">
          A reminder for the team, not legal or engineering advice: your local codes and licensed installers have the final word.
        </p>
        {open && !wasRead() ? (
          <Button variant="secondary" className="mt-4" onClick={markRead}>
            I have read these
          </Button>
        ) : null}
      </div>
    </details>
  );
}
