import { useState, type FormEvent } from 'react';
import { inviteStaffSchema } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { useStaff } from '../api/listStaff';
import { useInviteStaff } from '../api/inviteStaff';
import { useRemoveStaff } from '../api/removeStaff';
import { useCancelInvitation } from '../api/cancelInvitation';
import { ConfirmButton } from '../components/ConfirmButton';
import { SelectField } from '../../../ui/SelectField';
import { formProblems } from '../components/formProblems';

const ROLE_WORDS = { organizer: 'Organizer', judge: 'Judge' } as const;

function InviteForm({ eventId }: { eventId: number }) {
  const invite = useInviteStaff(eventId);
  const [form, setForm] = useState({ email: '', role: 'judge' });
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [sent, setSent] = useState<string>();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = inviteStaffSchema.safeParse(form);
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    invite.mutate(parsed.data, {
      onSuccess: (invitation) => {
        setSent(invitation.email);
        setForm({ ...form, email: '' });
      },
    });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
      aria-labelledby="invite-staff"
    >
      <h3 id="invite-staff" className="text-xl font-bold">
        Invite a judge or organizer
      </h3>
      <p>
        They get an e-mail with a link. The role is theirs once they accept it, signed in with that address.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field
          label="E-mail"
          type="email"
          value={form.email}
          onChange={(e) => {
            setSent(undefined);
            setForm({ ...form, email: e.target.value });
          }}
          error={problems.email}
        />
        <SelectField
          label="Role"
          value={form.role}
          onChange={(e) => setForm({ ...form, role: e.target.value })}
          error={problems.role}
        >
          <option value="judge">Judge</option>
          <option value="organizer">Organizer</option>
        </SelectField>
      </div>
      {invite.error && <Notice tone="error">{invite.error.message}</Notice>}
      {sent && <Notice tone="success">Invitation sent to {sent}.</Notice>}
      <Button type="submit" disabled={invite.isPending}>
        {invite.isPending ? 'Sending…' : 'Send invitation'}
      </Button>
    </form>
  );
}

/** Organizers and judges of the event, invitations still waiting, and a new invitation. */
export function StaffPart({ eventId }: { eventId: number }) {
  const staff = useStaff(eventId);
  const remove = useRemoveStaff(eventId);
  const cancel = useCancelInvitation(eventId);
  return (
    <>
      <h2 className="text-2xl font-bold">Staff</h2>
      {staff.isPending && <p>Loading staff…</p>}
      {staff.error && <Notice tone="error">{staff.error.message}</Notice>}
      {staff.data && (
        <>
          <ul className="space-y-2" aria-label="Organizers and judges">
            {staff.data.staff.map((s) => (
              <li
                key={`${s.userId}-${s.role}`}
                className="surface space-y-2 rounded-lg border border-line bg-card p-3"
              >
                <p>
                  <strong>{s.name}</strong> · {ROLE_WORDS[s.role]}
                  <span className="block break-all text-base">{s.email}</span>
                </p>
                <ConfirmButton
                  question={`Remove ${s.name} as ${s.role}?`}
                  confirmLabel="Yes, remove"
                  onConfirm={() => remove.mutate({ userId: s.userId, role: s.role })}
                >
                  Remove as {s.role}
                </ConfirmButton>
              </li>
            ))}
          </ul>
          {staff.data.staff.every((s) => s.role !== 'judge') && (
            <p>No judges yet. Invite them below: they rule on disputed arrows and sign ends.</p>
          )}
          {remove.error && <Notice tone="error">{remove.error.message}</Notice>}
          {staff.data.invitations.length > 0 && (
            <section aria-labelledby="pending" className="space-y-2">
              <h3 id="pending" className="text-xl font-bold">
                Waiting for an answer
              </h3>
              <ul className="space-y-2">
                {staff.data.invitations.map((i) => (
                  <li
                    key={i.id}
                    className="surface space-y-2 rounded-lg border border-dashed border-line bg-card p-3"
                    data-testid="pending-invitation"
                  >
                    <p>
                      <span className="break-all font-bold">{i.email}</span> · {ROLE_WORDS[i.role]}
                      <span className="block text-base">Sent {new Date(i.sentAt).toLocaleString()}</span>
                    </p>
                    <Button
                      variant="secondary"
                      onClick={() => cancel.mutate(i.id)}
                      disabled={cancel.isPending}
                    >
                      Cancel invitation
                    </Button>
                  </li>
                ))}
              </ul>
              {cancel.error && <Notice tone="error">{cancel.error.message}</Notice>}
            </section>
          )}
        </>
      )}
      <InviteForm eventId={eventId} />
    </>
  );
}
