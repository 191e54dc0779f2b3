/**
 * Hands a downloaded file to the browser under `fileName` (an object URL on a temporary link).
 * The URL is released after a pause so the download has started in every browser.
 */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
