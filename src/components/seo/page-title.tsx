/**
 * Sets the document title for the page it is rendered in; React hoists `<title>` into `<head>`.
 * Titles read most specific first: "Green Lots · Restday".
 */
export function PageTitle({ title }: { title?: string }) {
  return <title>{title ? `${title} · Restday` : 'Restday'}</title>;
}
