import { networkInterfaces, type NetworkInterfaceInfo } from 'node:os';
import type { LinkAddress } from '../src/contract/linkAddress';

type Interfaces = NodeJS.Dict<NetworkInterfaceInfo[]>;

/** IPv4 addresses of this machine that phones on the same network can use. */
export function lanAddresses(interfaces: Interfaces = networkInterfaces()): string[] {
  return Object.values(interfaces)
    .flat()
    .filter((a): a is NetworkInterfaceInfo => !!a && a.family === 'IPv4' && !a.internal)
    .map((a) => a.address);
}

/** Names a phone would resolve to itself (or that name no machine at all). */
export function isLoopbackHost(hostname: string): boolean {
  const h = hostname.replace(/^\[|\]$/g, '').toLowerCase();
  return (
    h === 'localhost' ||
    h.endsWith('.localhost') ||
    /^127\./.test(h) ||
    h === '::1' ||
    h === '0.0.0.0' ||
    h === '::'
  );
}

const LISTEN_ON_ALL = new Set(['', '0.0.0.0', '::']);
const urlHost = (host: string) => (host.includes(':') ? `[${host}]` : host);

/**
 * Decided once at start, never from a request's Host header (which the sender chooses):
 * PUBLIC_URL; else the one address the server listens on (HOST); else this machine's first
 * address on the local network; else localhost, flagged as unreachable from phones.
 */
export function resolveLinkAddress(
  settings: { publicUrl: string | undefined; host: string; port: number },
  interfaces: Interfaces = networkInterfaces(),
): LinkAddress {
  if (settings.publicUrl) {
    return {
      url: settings.publicUrl.replace(/\/+$/, ''),
      from: 'PUBLIC_URL',
      phonesCanOpen: !isLoopbackHost(new URL(settings.publicUrl).hostname),
    };
  }
  if (!LISTEN_ON_ALL.has(settings.host)) {
    return {
      url: `http://${urlHost(settings.host)}:${settings.port}`,
      from: 'HOST',
      phonesCanOpen: !isLoopbackHost(settings.host),
    };
  }
  const lan = lanAddresses(interfaces)[0];
  if (lan) return { url: `http://${lan}:${settings.port}`, from: 'network', phonesCanOpen: true };
  return { url: `http://localhost:${settings.port}`, from: 'none', phonesCanOpen: false };
}

/** The start-up line that says which address links use, and what to do when phones cannot open it. */
export function linkAddressLine(address: LinkAddress): string {
  const why: Record<LinkAddress['from'], string> = {
    PUBLIC_URL: 'from PUBLIC_URL',
    HOST: 'the address in HOST',
    network: "this machine's address on the local network; set PUBLIC_URL to use another",
    none: 'no network address found',
  };
  const line = `  Links:     ${address.url} in mail, QR codes and cards (${why[address.from]})`;
  return address.phonesCanOpen
    ? line
    : `${line}\n  ▲ Phones cannot open ${address.url}. ${address.from === 'HOST' ? 'Listen on all addresses (HOST=0.0.0.0)' : 'Join a network'}, or set PUBLIC_URL to an address phones can reach, and restart.`;
}
