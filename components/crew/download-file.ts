/**
 * Starts a browser download of a same-origin URL (the session cookie authorises it). The app
 * targets the web only (app.json), so a temporary anchor with `download` is enough.
 */
export function downloadUrl(url: string): void {
  const a = document.createElement('a');
  a.href = url;
  a.download = '';
  document.body.appendChild(a);
  a.click();
  a.remove();
}
