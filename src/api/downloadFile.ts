import { apiDownload } from './request';

/** Fetches a file with the person's sign-in and hands it to the browser as a download. */
export async function downloadFile(path: string, filename: string): Promise<void> {
  const blob = await apiDownload(path);
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
