/**
 * Hands a downloaded file to the browser as a save. API files need the bearer token, so they
 * are fetched with HttpClient and saved from a short-lived object URL instead of a plain link.
 */
export function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.rel = 'noopener';
  document.body.appendChild(link);
  link.click();
  link.remove();
  // Revoke on the next turn: the click has started the download by then.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
