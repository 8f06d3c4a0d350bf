import { useState, type ReactNode } from 'react';
import { Button } from '../../../ui/Button';

/**
 * A change that cannot be undone asks once, in place: the button turns into "Yes" and "Keep".
 * No pop-up dialog, so it works the same on a phone and a laptop.
 */
export function ConfirmButton({
  children,
  question,
  confirmLabel,
  onConfirm,
  disabled,
  variant = 'danger',
}: {
  children: ReactNode;
  question: string;
  confirmLabel: string;
  onConfirm: () => void;
  disabled?: boolean;
  variant?: 'danger' | 'secondary' | 'primary';
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button variant={variant} disabled={disabled} onClick={() => setAsking(true)}>
        {children}
      </Button>
    );
  }
  return (
    <div
      role="group"
      aria-label={question}
      className="surface flex flex-wrap items-center gap-2 rounded-lg border-2 border-brick bg-brick-bg p-2"
    >
      <p className="w-full font-bold text-brick">
        <span aria-hidden="true">▲ </span>
        {question}
      </p>
      <Button
        variant="danger"
        onClick={() => {
          setAsking(false);
          onConfirm();
        }}
      >
        {confirmLabel}
      </Button>
      <Button variant="secondary" onClick={() => setAsking(false)}>
        Keep it
      </Button>
    </div>
  );
}
