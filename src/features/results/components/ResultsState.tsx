import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
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
  if (query.isError) return <Notice tone="error">{query.error.message}</Notice>;
  return <p>Loading the results…</p>;
}
