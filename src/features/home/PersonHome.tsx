import { Link } from 'react-router-dom';
import type { Me } from '../../contract/auth';
import { AccountPanel } from './AccountPanel';
import { MyTargets } from './MyTargets';
import { CardSections, JudgeDesks, OrganizedEvents } from './RoleSections';

/**
 * A signed-in person's home: what their roles need, staff desks first for judges and organizers,
 * targets and cards first for everyone else. Creating an event stays one small link away.
 */
export function PersonHome({ me }: { me: Me }) {
  const judging = me.roles.filter((r) => r.role === 'judge');
  const organizing = me.roles.filter((r) => r.role === 'organizer');
  const archer = me.roles.some((r) => r.role === 'archer');
  const staff = (
    <>
      {judging.length > 0 && <JudgeDesks roles={judging} />}
      {organizing.length > 0 && <OrganizedEvents roles={organizing} />}
    </>
  );
  const field = (
    <>
      <MyTargets userId={me.user.id} />
      <CardSections archer={archer} />
    </>
  );
  const isStaff = judging.length > 0 || organizing.length > 0;
  return (
    <>
      <h1 className="text-3xl font-bold leading-tight">Your day on the field</h1>
      {isStaff ? staff : field}
      {isStaff ? field : staff}
      <AccountPanel me={me} />
      <p>
        <Link to="/events" className="inline-flex min-h-11 items-center text-base font-bold underline">
          {organizing.length > 0 ? 'All your events, or create an event' : 'Create an event'}
        </Link>
      </p>
    </>
  );
}
