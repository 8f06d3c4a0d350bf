import { apiDownload } from './request';

/** Hands a file made on the phone to the browser as a download (works offline). */
export function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser a moment to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Fetches a file with the person's sign-in and hands it to the browser as a download. */
export async function downloadFile(path: string, filename: string): Promise<void> {
  saveFile(await apiDownload(path), filename);
}
