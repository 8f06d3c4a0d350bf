import { useState } from 'react';
import type { CloseCheckTarget } from '../../../contract/lateValues';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { counted } from '../../../ui/counted';
import { useCloseCheck } from '../api/closeCheck';

function missingInWords(t: CloseCheckTarget): string {
  const parts = [
    t.notEntered > 0 && `${counted(t.notEntered, 'end')} not on the server from both writers`,
    t.notAgreed > 0 && `${counted(t.notAgreed, 'end')} not agreed`,
    t.notSigned > 0 && `${counted(t.notSigned, 'end')} not signed`,
    t.lateValues > 0 && `${counted(t.lateValues, 'late value')} waiting for a judge`,
  ].filter((p): p is string => !!p);
  return parts.join(', ');
}

/**
 * Closing a session asks first, showing what the server does not hold yet, target by target, so
 * the organizer can wait for phones still offline. Closing loses nothing: values that arrive
 * later wait for a judge.
 */
export function CloseSessionButton({
  eventId,
  sessionId,
  name,
  onClose,
}: {
  eventId: number;
  sessionId: number;
  name: string;
  onClose: () => void;
}) {
  const [asking, setAsking] = useState(false);
  const check = useCloseCheck(eventId, sessionId, asking);
  if (!asking) {
    return (
      <Button variant="secondary" onClick={() => setAsking(true)}>
        Close session
      </Button>
    );
  }
  const targets = check.data?.targets ?? [];
  return (
    <section
      aria-labelledby={`close-${sessionId}`}
      data-testid="close-check"
      className="surface w-full space-y-2 rounded-lg border-2 border-brick bg-brick-bg p-3 text-brick"
    >
      <h3 id={`close-${sessionId}`} className="font-bold">
        <span aria-hidden="true">▲ </span>Close {name}?
      </h3>
      {check.isPending && <p>Asking the server what it holds…</p>}
      {check.error && <Notice tone="error">{check.error.message}</Notice>}
      {check.data &&
        (targets.length === 0 ? (
          <p>The server holds every end of this session, agreed and signed.</p>
        ) : (
          <>
            <p>The server does not hold everything yet:</p>
            <ul className="list-disc space-y-1 pl-5">
              {targets.map((t) => (
                <li key={t.targetNumber}>
                  <strong>Target {t.targetNumber}:</strong> {missingInWords(t)}
                </li>
              ))}
            </ul>
          </>
        ))}
      <p>
        Writers can no longer change ends once it is closed. Values still on phones are not lost: when they
        arrive, a judge accepts or rejects them.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="danger"
          disabled={!check.data && !check.error}
          onClick={() => {
            setAsking(false);
            onClose();
          }}
        >
          Yes, close it
        </Button>
        <Button variant="secondary" onClick={() => setAsking(false)}>
          Keep it open
        </Button>
      </div>
    </section>
  );
}
