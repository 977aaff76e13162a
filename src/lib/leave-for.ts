/** Sends the browser to a page outside the SPA (the payment page), leaving this app. */
export function leaveFor(url: string): void {
  window.location.assign(url);
}
