import type { FieldMutation as Mutation } from '../../../src/contract/sync';
import type { SigningKeys } from '../signing/serverKeys';
import { applyShootOff } from '../results/applyShootOff';
import { applyCardSign } from './applyCardSign';
import { applyEndSign } from './applyEndSign';
import { applyEndWrite } from './applyEndWrite';
import { applyRuling } from './applyRuling';
import { applySettlement } from './applySettlement';
import type { Author } from './effects';
import type { FieldBatch } from './fieldBatch';
import { Refusal, refuse } from './fieldRules';

/**
 * A signature or a ruling is its maker's own act: from a file no phone signed, a judge can
 * transcribe values but never carry another person's signature, countersignature or ruling.
 */
function refuseTranscribedJudging(kind: Mutation['kind'], judge: string): never {
  const what =
    kind === 'card.sign'
      ? 'A signature on a card'
      : kind === 'end.sign'
        ? 'A judge’s signature on an end'
        : 'A ruling';
  refuse(
    `${what} counts only from its maker’s own phone. This file was not signed by that phone, so ${judge} can bring in its values but not this; ask its maker to do it again on their phone.`,
  );
}

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
    if (by.transcribedBy && m.kind !== 'end.write' && m.kind !== 'end.settle')
      refuseTranscribedJudging(m.kind, by.transcribedBy.name);
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
