import { useState } from 'react';
import type { CardView } from '../../contract/judging';
import { messageOf } from '../../api/request';
import { localDb } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useOnline } from '../../local/online';
import { Button } from '../../ui/Button';
import { FileField, photoInput } from '../../ui/FileField';
import { Notice } from '../../ui/Notice';
import { uploadPhoto } from '../../api/uploadPhoto';

/**
 * A judge records the countersignature an archer without an account made on the paper card: a
 * photo of the paper card goes to the server (it needs signal), then the signature goes through
 * the outbox like any judge's action, labelled "countersigned on paper, recorded by judge …".
 */
export function PaperCountersign({ card, userId }: { card: CardView; userId: number }) {
  const [photo, setPhoto] = useState<File>();
  const [problem, setProblem] = useState<string>();
  const [busy, setBusy] = useState(false);
  const online = useOnline();

  const record = async () => {
    if (!photo) return setProblem('Take a photo of the paper card with the archer’s signature first.');
    setBusy(true);
    setProblem(undefined);
    try {
      const { photoId } = await uploadPhoto(card.event.id, photo);
      await recordChange(localDb(), userId, {
        kind: 'card.sign',
        args: {
          sessionId: card.session.id,
          entryId: card.archer.entryId,
          role: 'archer',
          total: card.totals.total,
          paper: { photoId },
        },
      });
      syncLoop().kick();
    } catch (error) {
      setProblem(messageOf(error));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="surface space-y-2 rounded-xl border-2 border-ink bg-card p-3">
      <h2 className="text-xl font-bold">Countersigned on paper</h2>
      <p>
        {card.archer.name} has no account, so cannot sign on a phone. If they signed the paper card for{' '}
        {card.totals.total}, record it here with a photo of that card. The signature will say it was made on
        paper and recorded by you.
      </p>
      <FileField
        label="Photo of the signed paper card"
        hint={online ? undefined : 'The photo needs signal.'}
        {...photoInput}
        disabled={!online || busy}
        onChange={(e) => setPhoto(e.target.files?.[0])}
      />
      <Button className="w-full" disabled={!online || busy} onClick={() => void record()}>
        {busy ? 'Saving…' : '✍ Record the countersignature made on paper'}
      </Button>
      {problem && <Notice tone="error">{problem}</Notice>}
    </div>
  );
}
