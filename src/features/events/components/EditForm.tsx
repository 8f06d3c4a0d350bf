import type { FormEvent, ReactNode } from 'react';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';

/** An inline edit: the fields, the server's answer if it refused, Save and Cancel. */
export function EditForm({
  children,
  onSubmit,
  onCancel,
  saveLabel,
  pending,
  error,
}: {
  children: ReactNode;
  onSubmit: (e: FormEvent) => void;
  onCancel: () => void;
  saveLabel: string;
  pending: boolean;
  error: Error | null;
}) {
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      {children}
      {error && <Notice tone="error">{error.message}</Notice>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {saveLabel}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
