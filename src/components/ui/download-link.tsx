import { Download } from 'lucide-react';
import type { ReactNode } from 'react';
import { buttonStyles } from './button';

type DownloadLinkProps = {
  href: string;
  children: ReactNode;
  /** A secondary button unless given. */
  className?: string;
};

/** A file the server builds (CSV, PDF): a plain link, so the browser downloads it with the session cookie. */
export function DownloadLink({ href, children, className = buttonStyles('secondary') }: DownloadLinkProps) {
  return (
    <a href={href} download className={className}>
      <Download aria-hidden="true" className="size-4" />
      {children}
    </a>
  );
}
