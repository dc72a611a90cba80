import type { ReactNode } from 'react';
import { Spinner } from './button.tsx';
import { PageHeading } from './card.tsx';

/** The part of a TanStack Query result a page shows: loading, the error, the data. */
export type QueryState<T> = { isPending: boolean; isError: boolean; error: Error | null; data: T | undefined };

/**
 * A query's loading and error states, then its data: a spinner with `loading` while the first answer
 * is on its way, the error's message when a fetch fails (above the data still held, if any), and
 * `children` with the data whenever there is some.
 */
export function QueryBoundary<T>({ query, loading, children }: { query: QueryState<T>; loading: string; children: (data: T) => ReactNode }) {
  return (
    <>
      {query.isPending ? <Spinner label={loading} /> : null}
      {query.isError ? (
        <p role="alert" className="font-semibold text-danger">
          {query.error?.message}
        </p>
      ) : null}
      {query.data !== undefined ? children(query.data) : null}
    </>
  );
}

/**
 * A page that shows one query: its heading, then the QueryBoundary's loading and error states and
 * `children` with the data; `narrow` keeps the content to a form's width.
 */
export function QueryPage<T>({
  eyebrow,
  title,
  lead,
  narrow = false,
  query,
  loading,
  children,
}: {
  eyebrow: string;
  title: string;
  lead: string;
  narrow?: boolean;
  query: QueryState<T>;
  loading: string;
  children: (data: T) => ReactNode;
}) {
  const boundary = (
    <QueryBoundary query={query} loading={loading}>
      {children}
    </QueryBoundary>
  );
  return (
    <div>
      <PageHeading eyebrow={eyebrow} title={title} lead={lead} />
      {narrow ? <div className="max-w-3xl">{boundary}</div> : boundary}
    </div>
  );
}
