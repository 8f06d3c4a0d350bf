import type { ReactNode } from 'react';
import { RequireSignIn } from '../../account/RequireSignIn';
import { Notice } from '../../ui/Notice';

/** Shows its screen only to a judge of the event; anyone else is told who does this (`only`). */
export function JudgeOnly({
  eventId,
  only,
  children,
}: {
  eventId: number;
  only: string;
  children: (userId: number) => ReactNode;
}) {
  return (
    <RequireSignIn>
      {(me) =>
        !me.roles.some((r) => r.eventId === eventId && r.role === 'judge') ? (
          <Notice tone="error">{only}</Notice>
        ) : (
          children(me.user.id)
        )
      }
    </RequireSignIn>
  );
}
