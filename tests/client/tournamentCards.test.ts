import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { TournamentCard } from '../../src/contract/myCards';
import { LocalDb, NO_ACCOUNT } from '../../src/local/db';
import { claimPhone, ownerSettled, releasePhone } from '../../src/local/phoneOwner';
import { refreshTournamentCards } from '../../src/features/practice/tournamentCards';
import { tournamentCardsKey } from '../../src/local/personMeta';

/*
 * The person's tournament cards kept on the phone for the log and progress: asked for when either
 * opens, and written only when the answer differs, since a write makes both screens read and draw
 * everything again (a year of practice, three charts).
 */

const answer = vi.hoisted(() => ({ cards: [] as unknown[] }));
const apiRequest = vi.hoisted(() => vi.fn(async () => answer));
vi.mock('../../src/api/request', () => ({ apiRequest }));

const card: TournamentCard = {
  sessionId: 4,
  entryId: 9,
  eventName: 'Club Shoot',
  sessionName: 'Saturday',
  startedAt: '2026-11-28T09:00:00.000Z',
  bowStyle: 'recurve',
  final: true,
  ends: [{ index: 0, distanceM: 70, faceId: 'full-122', values: ['10', '9', '9'] }],
};

afterEach(() => releasePhone());

describe('refreshTournamentCards', () => {
  it('keeps a new answer, and writes nothing when the answer is the copy kept', async () => {
    claimPhone(7);
    await ownerSettled();
    const db = new LocalDb('tournament-cards-test');
    answer.cards = [card];
    await refreshTournamentCards(7, db);
    expect((await db.meta.get(tournamentCardsKey(7)))?.value).toEqual([card]);

    const put = vi.spyOn(db.meta, 'put');
    await refreshTournamentCards(7, db);
    expect(put).not.toHaveBeenCalled();
    answer.cards = [{ ...card, final: false }];
    await refreshTournamentCards(7, db);
    expect(put).toHaveBeenCalledTimes(1);
    expect((await db.meta.get(tournamentCardsKey(7)))?.value).toEqual([{ ...card, final: false }]);
    await db.delete();
  });

  it('asks nothing with no one signed in', async () => {
    const db = new LocalDb('tournament-cards-none');
    apiRequest.mockClear();
    await refreshTournamentCards(NO_ACCOUNT, db);
    expect(apiRequest).not.toHaveBeenCalled();
    expect(await db.meta.count()).toBe(0);
    await db.delete();
  });
});
