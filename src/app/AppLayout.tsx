import { ConnectionBadge } from '../ui/ConnectionBadge';
import { useSyncBridge } from '../local/useSync';
import { Frame } from './Frame';

/**
 * The frame of the app's own screens, with the sync loop and its badge. Its own chunk: it brings
 * the phone's database (Dexie) and the sync engine, which the public results pages do without.
 */
export function AppLayout() {
  useSyncBridge();
  return <Frame status={<ConnectionBadge />} />;
}
