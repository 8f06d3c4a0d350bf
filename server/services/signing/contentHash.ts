import { createHash } from 'node:crypto';
import { canonicalJson } from '../../../src/core';

/** SHA-256 (base64url) of the canonical JSON of what was signed: any later change shows. */
export const contentHash = (content: unknown): string =>
  createHash('sha256').update(canonicalJson(content)).digest('base64url');
