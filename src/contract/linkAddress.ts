/**
 * The address put into links that leave the server (mail, printed QR codes, final cards), and
 * where it came from. Phones must be able to open it, so a loopback address is flagged.
 */
export type LinkAddress = {
  url: string;
  /**
   * `PUBLIC_URL`: configured; `HOST`: the one address the server listens on; `network`: this
   * machine's first address on the local network; `none`: no network address was found.
   */
  from: 'PUBLIC_URL' | 'HOST' | 'network' | 'none';
  /** False for localhost / 127.x / ::1: a phone opening it would reach itself, not this server. */
  phonesCanOpen: boolean;
};
