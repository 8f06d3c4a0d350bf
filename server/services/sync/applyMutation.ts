import type { Mutation } from '../../../src/contract/sync';
import type { SigningKeys } from '../../signing/serverKeys';
import { applyShootOff } from '../results/applyShootOff';
import { applyCardSign } from './applyCardSign';
import { applyEndSign } from './applyEndSign';
import { applyEndWrite } from './applyEndWrite';
import { applyRuling } from './applyRuling';
import { applySettlement } from './applySettlement';
import type { Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { Refusal } from './fieldRules';

function keysFor(signingKeys: SigningKeys | undefined): SigningKeys {
  if (!signingKeys) throw new Error('pushBatch needs the signing keys to apply signatures.');
  return signingKeys;
}

/** Applies one mutation to the batch's state; a broken rule comes back as its reason, with nothing changed. */
export async function applyMutation(
  batch: FieldBatch,
  m: Mutation,
  by: Author,
  signingKeys: SigningKeys | undefined,
): Promise<string | null> {
  try {
    switch (m.kind) {
      case 'end.write':
        applyEndWrite(batch, m.args, by);
        break;
      case 'end.settle':
        applySettlement(batch, m.args, by);
        break;
      case 'end.rule':
        applyRuling(batch, m.args, by);
        break;
      case 'end.sign':
        await applyEndSign(batch, m.args, by, keysFor(signingKeys));
        break;
      case 'card.sign':
        await applyCardSign(batch, m.args, by, keysFor(signingKeys));
        break;
      case 'shootoff.record':
        applyShootOff(batch, m.args, by);
        break;
    }
    return null;
  } catch (error) {
    if (error instanceof Refusal) return error.message;
    throw error;
  }
}
