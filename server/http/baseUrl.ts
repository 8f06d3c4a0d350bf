import type { Request } from 'express';

/** The address people use to reach this server: PUBLIC_URL, or what the request came in on. */
export function baseUrl(req: Request, publicUrl: string | undefined): string {
  if (publicUrl) return publicUrl.replace(/\/$/, '');
  return `${req.protocol}://${req.get('host') ?? 'localhost'}`;
}
