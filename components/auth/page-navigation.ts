/** Leaves the app for a full-page navigation (sign-in runs through the server's redirects). */
export function assignPageLocation(url: string): void {
  window.location.assign(url);
}
