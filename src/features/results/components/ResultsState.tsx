import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { ApiError } from '../../../api/request';
import { RESULTS_NOT_PUBLISHED } from '../../../contract/resultsAccess';
import { signInThenBack } from '../../../account/nextPath';
import { Notice } from '../../../ui/Notice';
import type { HeldResults } from '../../../api/eventResults';
import { asOf } from './labels';

/**
 * The results once loaded, with a word on where they come from: an error with nothing held is
 * shown as such; an error with a held copy (offline) keeps that copy on screen, saying so.
 */
export function ResultsState({
  query,
  children,
}: {
  query: UseQueryResult<HeldResults>;
  children: (held: HeldResults) => ReactNode;
}) {
  if (query.data) {
    return (
      <>
        {query.isError && (
          <Notice tone="info">
            Showing the copy from {asOf(query.data.results.computedAt)}: {query.error.message}
          </Notice>
        )}
        {children(query.data)}
      </>
    );
  }
  if (query.error instanceof ApiError && query.error.code === RESULTS_NOT_PUBLISHED)
    return <NotPublishedYet message={query.error.message} />;
  if (query.isError) return <Notice tone="error">{query.error.message}</Notice>;
  return <p>Loading the results…</p>;
}

/** Results not out yet, asked for without signing in: the event's own people may sign in to see them. */
function NotPublishedYet({ message }: { message: string }) {
  const here = useLocation();
  return (
    <div className="space-y-3">
      <Notice tone="info">{message}</Notice>
      <Link
        to={signInThenBack(here.pathname + here.search)}
        className="inline-flex min-h-12 items-center font-bold underline"
      >
        Sign in
      </Link>
    </div>
  );
}
