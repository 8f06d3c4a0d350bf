import type { ResultsSendReport } from '../../../contract/results';
import { Button } from '../../../ui/Button';
import { Notice } from '../../../ui/Notice';
import { useSendResults } from '../api/sendResults';

const archers = (n: number) => `${n} archer${n === 1 ? '' : 's'}`;

function reportText(r: ResultsSendReport): string {
  const parts = [`Sent to ${archers(r.sent)}.`];
  if (r.withoutAddress > 0) parts.push(`${archers(r.withoutAddress)} without an e-mail address got none.`);
  if (r.failed > 0) parts.push(`The mail server refused ${r.failed}; send again later.`);
  return parts.join(' ');
}

/** The organizer mails every archer their own place and the link to the public results page. */
export function SendResults({ eventId, published }: { eventId: number; published: boolean }) {
  const send = useSendResults(eventId);
  return (
    <div className="space-y-2">
      <Button variant="secondary" disabled={!published || send.isPending} onClick={() => send.mutate()}>
        {send.isPending ? 'Sending…' : 'Send results to the archers'}
      </Button>
      <p className="text-base text-ink-soft">
        {published
          ? 'Each archer with an e-mail address gets their own place and the link to this event’s results page. A few sends an hour.'
          : 'Publish the results first: the mail links to the public results page.'}
      </p>
      {send.error && <Notice tone="error">{send.error.message}</Notice>}
      {send.data && (
        <Notice tone={send.data.failed > 0 ? 'error' : 'success'}>{reportText(send.data)}</Notice>
      )}
    </div>
  );
}
