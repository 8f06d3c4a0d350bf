import { localDb } from './db';
import { exportWaiting } from './outbox';
import { phoneOwner } from './phoneOwner';

/** Downloads the waiting changes of the person whose data this phone holds, for a judge to import. */
export async function saveWaitingFile(): Promise<void> {
  const owner = phoneOwner();
  if (owner === undefined) return;
  const { fileName, json } = await exportWaiting(localDb(), owner);
  const url = URL.createObjectURL(new Blob([json], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.click();
  URL.revokeObjectURL(url);
}
