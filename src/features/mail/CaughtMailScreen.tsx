import { useState } from 'react';
import { apiDownload } from '../../api/request';
import { RequireSignIn } from '../auth/RequireSignIn';
import { Notice } from '../../ui/Notice';
import { Button } from '../../ui/Button';
import { useCaughtMail, useCaughtMailList } from './api/caughtMail';

async function saveAttachment(mailId: number, index: number, filename: string) {
  const blob = await apiDownload(`/api/caught-mail/${mailId}/attachments/${index}`);
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.click();
  URL.revokeObjectURL(url);
}

function Message({ id, onBack }: { id: number; onBack: () => void }) {
  const mail = useCaughtMail(id);
  if (mail.isPending) return <p>Opening…</p>;
  if (mail.error) return <Notice tone="error">{mail.error.message}</Notice>;
  const m = mail.data;
  return (
    <article className="space-y-3">
      <Button variant="secondary" onClick={onBack}>
        ← All caught mail
      </Button>
      <h2 className="text-2xl font-bold">{m.subject}</h2>
      <p className="text-base">
        To {m.to} · {new Date(m.receivedAt).toLocaleString()}
      </p>
      <pre className="surface whitespace-pre-wrap break-words rounded-lg border border-line bg-card p-4 font-sans">
        {linkify(m.text)}
      </pre>
      {m.attachments.map((a) => (
        <Button
          key={a.index}
          variant="secondary"
          onClick={() => void saveAttachment(m.id, a.index, a.filename)}
        >
          Download {a.filename}
        </Button>
      ))}
    </article>
  );
}

/** Links inside caught mail open in the app, so invitations can be followed in the demo. */
function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all font-bold underline">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

function Inbox() {
  const list = useCaughtMailList();
  const [open, setOpen] = useState<number>();
  if (open !== undefined) return <Message id={open} onBack={() => setOpen(undefined)} />;
  if (list.isPending) return <p>Loading caught mail…</p>;
  if (list.error) return <Notice tone="error">{list.error.message}</Notice>;
  if (list.data.messages.length === 0) {
    return (
      <p>
        No mail yet. Invitations, confirmations and signed cards will appear here while Ringcall catches mail
        locally.
      </p>
    );
  }
  return (
    <ul className="space-y-2">
      {list.data.messages.map((m) => (
        <li key={m.id}>
          <button
            type="button"
            onClick={() => setOpen(m.id)}
            className="surface block min-h-14 w-full rounded-lg border border-line bg-card p-3 text-left"
          >
            <span className="block font-bold">{m.subject}</span>
            <span className="block text-base">
              To {m.to} · {new Date(m.receivedAt).toLocaleString()}
            </span>
          </button>
        </li>
      ))}
    </ul>
  );
}

/** The inbox of the app's own mail catcher (demo and development; no real mail leaves). */
export function CaughtMailScreen() {
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Caught mail</h1>
      <p className="text-base">
        This server keeps outgoing mail here instead of sending it. Organizers see all of it; others see their
        own.
      </p>
      <RequireSignIn>{() => <Inbox />}</RequireSignIn>
    </div>
  );
}
