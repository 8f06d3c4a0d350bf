import { POSITIONS, type Target } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { ConfirmButton } from './ConfirmButton';
import { keepUnits } from './formProblems';

/**
 * One target: its archers A–D in their details, the faces to hang, and its join code with QR.
 * Every action is a button; nothing depends on dragging.
 */
export function TargetCard({
  target,
  conflicted,
  closed,
  onPick,
  onReissue,
  onRevoke,
}: {
  target: Target;
  conflicted: boolean;
  closed: boolean;
  onPick: (entryId: number) => void;
  onReissue: () => void;
  onRevoke: () => void;
}) {
  const faces =
    target.faceUse === 'shared'
      ? '1 face, shared'
      : `${target.facesPerTarget} ${target.facesPerTarget === 1 ? 'face' : 'faces'}, one per archer`;
  return (
    <li
      className={`surface space-y-3 rounded-xl border-2 bg-card p-4 ${conflicted ? 'border-brick' : 'border-line'}`}
      data-testid={`target-${target.targetNumber}`}
    >
      <div className="flex items-baseline justify-between gap-2">
        <h3 className="text-2xl font-bold">Target {target.targetNumber}</h3>
        <p className="text-base">{faces}</p>
      </div>
      {conflicted && (
        <p className="font-bold text-brick">
          <span aria-hidden="true">▲ </span>Check this target (see the list above)
        </p>
      )}
      <ol className="space-y-2">
        {POSITIONS.map((position) => {
          const archer = target.archers.find((a) => a.position === position);
          return (
            <li key={position} className="flex items-center gap-3">
              <span
                aria-label={`Position ${position}`}
                className="flex h-12 w-12 shrink-0 items-center justify-center rounded-lg bg-ink text-2xl font-bold text-white"
              >
                {position}
              </span>
              {archer ? (
                <>
                  <span className="min-w-0 flex-1">
                    <span className="block font-bold leading-tight" data-testid="archer-name">
                      {archer.name}
                    </span>
                    <span className="block text-base leading-tight text-ink-soft">
                      {archer.divisionName}
                      {archer.roundName ? ` · ${keepUnits(archer.roundName)}` : ' · no round'}
                    </span>
                  </span>
                  {!closed && (
                    <button
                      type="button"
                      onClick={() => onPick(archer.entryId)}
                      className="min-h-12 shrink-0 rounded-lg border-2 border-ink px-3 text-base font-bold text-ink active:scale-[0.97]"
                      aria-label={`Move or swap ${archer.name}`}
                    >
                      Move
                    </button>
                  )}
                </>
              ) : (
                <span className="flex-1 text-ink-soft">free</span>
              )}
            </li>
          );
        })}
      </ol>
      <div className="border-t border-line pt-3">
        {target.joinCode ? (
          <div className="flex items-center gap-3">
            <img
              src={target.joinCode.qrDataUrl}
              alt={`QR code for joining target ${target.targetNumber}`}
              className="h-28 w-28 shrink-0 rounded border border-line bg-white"
            />
            <div className="min-w-0">
              <p className="text-base">Join code</p>
              <p className="text-3xl font-bold tracking-[0.15em]" data-testid="join-code">
                {target.joinCode.code}
              </p>
            </div>
          </div>
        ) : (
          <p>
            <span aria-hidden="true">▲ </span>No join code: phones cannot join this target.
          </p>
        )}
        <div className="mt-3 flex flex-wrap gap-2">
          {target.joinCode ? (
            <>
              <ConfirmButton
                variant="secondary"
                question="Issue a new code? Sheets printed with the old one stop working."
                confirmLabel="Yes, new code"
                onConfirm={onReissue}
              >
                New code
              </ConfirmButton>
              <ConfirmButton
                question="Revoke this code? No phone can join until a new one is issued."
                confirmLabel="Yes, revoke"
                onConfirm={onRevoke}
              >
                Revoke code
              </ConfirmButton>
            </>
          ) : (
            <Button variant="secondary" onClick={onReissue}>
              Issue a code
            </Button>
          )}
        </div>
      </div>
    </li>
  );
}
