import { createServer, type Server } from 'node:http';

/** How long a connection may take to send what it means to send. */
export type ConnectionLimits = {
  /** The request line and headers. */
  headersMs: number;
  /** The whole request, body included. */
  requestMs: number;
  /** How often open connections are checked against the two limits above. */
  checkEveryMs: number;
};

/**
 * Generous for a phone on one bar of signal (a push is at most 256 KB: ~40 s at 50 kbit/s), short
 * enough that a laptop on the field network cannot hold hundreds of connections open by sending a
 * byte now and then (Node's own defaults keep such a request for five minutes).
 */
export const FIELD_LIMITS: ConnectionLimits = { headersMs: 20_000, requestMs: 60_000, checkEveryMs: 5_000 };

/** The HTTP server the product listens with: a request too slow to arrive is answered 408 and closed. */
export function createFieldServer(limits: ConnectionLimits = FIELD_LIMITS): Server {
  return createServer({
    headersTimeout: limits.headersMs,
    requestTimeout: limits.requestMs,
    connectionsCheckingInterval: limits.checkEveryMs,
  });
}
