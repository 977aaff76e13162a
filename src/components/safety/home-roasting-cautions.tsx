import { CautionPanel } from '@/components/ui/caution-panel';

/** The home-roasting safety cautions, each with where it comes from. */
export function HomeRoastingCautions() {
  return (
    <CautionPanel title="Roast safely">
      <ul className="list-disc space-y-2 pl-5">
        <li>
          <strong>Never leave a roast unattended.</strong> Cooking equipment is involved in 47% of US home fires, and equipment left unattended is the leading
          cause. <cite className="text-small not-italic text-ink-muted">(NFPA, Home Fires Involving Cooking Equipment, 2017)</cite>
        </li>
        <li>
          <strong>Ventilate.</strong> Roasting makes smoke that can set off alarms: open a window or run the range hood.{' '}
          <cite className="text-small not-italic text-ink-muted">(common practice)</cite>
        </li>
        <li>
          <strong>Chaff burns.</strong> Catch it as it flies off the beans and clear it away after every roast.{' '}
          <cite className="text-small not-italic text-ink-muted">(common practice)</cite>
        </li>
        <li>
          <strong>Everything is hot.</strong> The device, its chimney and the beans: use an oven mitt.{' '}
          <cite className="text-small not-italic text-ink-muted">(common practice)</cite>
        </li>
        <li>
          <strong>Cool the beans at once.</strong> Beans keep roasting from their own heat until they are cooled.{' '}
          <cite className="text-small not-italic text-ink-muted">(common practice)</cite>
        </li>
        <li>
          <strong>A popcorn popper roasting coffee is used outside its maker&rsquo;s intended purpose.</strong> Follow the maker&rsquo;s instructions for
          everything else, and stay with it.
        </li>
      </ul>
      <p className="mt-4 text-small text-ink-muted">
        These are cautions, not legal advice. Your device maker&rsquo;s instructions and your local fire codes come first.
      </p>
    </CautionPanel>
  );
}
