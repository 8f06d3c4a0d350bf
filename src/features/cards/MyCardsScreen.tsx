import { RequireSignIn } from '../../account/RequireSignIn';
import { Notice } from '../../ui/Notice';
import { useMyCards } from '../../api/card';
import { CardsToSignList, OwnCardsList } from '../../ui/scorecard/CardLists';

function Lists() {
  const cards = useMyCards();
  if (cards.isPending) return <p>Loading your cards…</p>;
  if (cards.error) return <Notice tone="error">{cards.error.message}</Notice>;
  const { cards: own, toSign } = cards.data;
  return (
    <>
      {toSign.length > 0 && (
        <section className="space-y-2" aria-labelledby="to-sign">
          <h2 id="to-sign" className="text-2xl font-bold">
            Cards to sign as scorer
          </h2>
          <CardsToSignList cards={toSign} />
        </section>
      )}
      <section className="space-y-2" aria-labelledby="own-cards">
        <h2 id="own-cards" className="text-2xl font-bold">
          Your own cards
        </h2>
        {own.length > 0 ? (
          <OwnCardsList cards={own} />
        ) : (
          <p>
            No scorecards of your own yet. Once an organizer puts you on a target, your card appears here.
          </p>
        )}
      </section>
    </>
  );
}

/** The person's own cards, and the ones they kept as a writer and must sign as scorer. */
export function MyCardsScreen() {
  return (
    <div className="space-y-4">
      <h1 className="text-3xl font-bold">Your scorecards</h1>
      <RequireSignIn>{() => <Lists />}</RequireSignIn>
    </div>
  );
}
