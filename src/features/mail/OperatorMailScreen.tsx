import { useEffect, useState, type FormEvent } from 'react';
import { messageOf } from '../../api/request';
import { Notice } from '../../ui/Notice';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import {
  rememberOperatorKey,
  takeOperatorKey,
  useOperatorMail,
  useOperatorMailList,
  useSaveAttachment,
} from './api/operatorMail';

function Message({ operatorKey, id, onBack }: { operatorKey: string; id: number; onBack: () => void }) {
  const mail = useOperatorMail(operatorKey, id);
  const save = useSaveAttachment(operatorKey);
  const [saveError, setSaveError] = useState<string>();
  if (mail.error) return <Notice tone="error">{mail.error}</Notice>;
  if (!mail.data) return <p>Opening…</p>;
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
          onClick={() =>
            void save(m.id, a.index, a.filename).catch((error: unknown) => setSaveError(messageOf(error)))
          }
        >
          Download {a.filename}
        </Button>
      ))}
      {saveError && <Notice tone="error">{saveError}</Notice>}
    </article>
  );
}

/** Links inside caught mail open in this browser, so the operator can follow them in a trial. */
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

function Inbox({ operatorKey, onWrongKey }: { operatorKey: string; onWrongKey: () => void }) {
  const list = useOperatorMailList(operatorKey);
  const [open, setOpen] = useState<number>();
  if (open !== undefined)
    return <Message operatorKey={operatorKey} id={open} onBack={() => setOpen(undefined)} />;
  if (list.error)
    return (
      <div className="space-y-3">
        <Notice tone="error">{list.error}</Notice>
        {list.status === 401 && (
          <Button variant="secondary" onClick={onWrongKey}>
            Enter the key again
          </Button>
        )}
      </div>
    );
  if (!list.data) return <p>Loading caught mail…</p>;
  if (list.data.messages.length === 0) {
    return <p>No mail yet. Invitations, confirmations and signed cards will appear here.</p>;
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

function KeyForm({ onKey }: { onKey: (key: string) => void }) {
  const [key, setKey] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (key.trim()) onKey(key.trim());
  };
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <Field
        label="Inbox key"
        hint="Printed by the server when it started (also in the file mail-inbox-secret in its data folder)."
        autoComplete="off"
        value={key}
        onChange={(e) => setKey(e.target.value)}
        required
      />
      <Button type="submit">Open the inbox</Button>
    </form>
  );
}

/**
 * The mail catcher's inbox, for the person running the server (demo, development, trials): it
 * holds everyone's confirmation and invitation links, so no sign-in or event role opens it.
 */
export function OperatorMailScreen() {
  const [key, setKey] = useState(takeOperatorKey);
  // The printed address pasted into a tab already on this screen changes only the hash.
  useEffect(() => {
    const onHash = () => setKey((current) => takeOperatorKey() ?? current);
    window.addEventListener('hashchange', onHash);
    return () => window.removeEventListener('hashchange', onHash);
  }, []);
  const use = (next: string | undefined) => {
    rememberOperatorKey(next);
    setKey(next);
  };
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Caught mail</h1>
      <p className="text-base">
        This server keeps outgoing mail here instead of sending it. Only the person running the server can
        open it, with the key the server printed when it started.
      </p>
      {key ? <Inbox operatorKey={key} onWrongKey={() => use(undefined)} /> : <KeyForm onKey={use} />}
    </div>
  );
}
