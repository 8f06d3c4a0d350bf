import type { LinkAddress } from '../../../contract/linkAddress';

const WHERE: Record<LinkAddress['from'], string> = {
  PUBLIC_URL: 'the address set in PUBLIC_URL',
  HOST: 'the address the server listens on (HOST)',
  network: "the server machine's address on the local network",
  none: 'the server found no network address',
};

/**
 * Which address the QR codes and join links on the paper open, and a warning when a phone could
 * not open it (a loopback address, as when printing from the server machine with no network).
 */
export function LinkAddressNote({ address }: { address: LinkAddress }) {
  const how = (
    <>
      To print another address, start the server with <code>PUBLIC_URL</code> set to an address phones can
      open (for example <code className="break-all">PUBLIC_URL=http://192.168.1.20:3000</code>), then print
      again.
    </>
  );
  if (!address.phonesCanOpen) {
    return (
      <div
        role="alert"
        data-testid="link-address"
        className="surface space-y-1 rounded-lg border-2 border-brick bg-brick-bg p-3 text-brick"
      >
        <p className="font-bold">
          <span aria-hidden="true">▲ </span>Phones cannot open the address on the paper: {address.url}
        </p>
        <p className="text-base">
          A phone opening it would reach itself, not this server ({WHERE[address.from]}).{' '}
          {address.from === 'HOST' && (
            <>
              The server only listens on this machine: start it with <code>HOST=0.0.0.0</code> so phones reach
              it.{' '}
            </>
          )}
          {how}
        </p>
      </div>
    );
  }
  return (
    <p className="text-base" data-testid="link-address">
      QR codes and join links open <strong className="break-all">{address.url}</strong> ({WHERE[address.from]}
      ). Phones must be on a network that reaches it. {how}
    </p>
  );
}
