import { type ReactNode, useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';
import { PAGE_MAX, pageCount } from '../../../shared/schemas/pagination.ts';
import { Button } from './button.tsx';
import { StitchedBox } from './card.tsx';
import { QueryBoundary, type QueryState } from './query-boundary.tsx';

/**
 * The page number of a list, kept in the URL (`?page=2`, or another name when a screen has two
 * lists) so a reload, the back button or a shared link opens the same page. Page 1 is left out.
 */
export function usePageParam(name = 'page'): [number, (page: number, opts?: { replace?: boolean }) => void] {
  const [params, setParams] = useSearchParams();
  const raw = Number(params.get(name) ?? '1');
  const page = Number.isInteger(raw) && raw >= 1 && raw <= PAGE_MAX ? raw : 1;
  const setPage = useCallback(
    (next: number, opts?: { replace?: boolean }) =>
      setParams(
        (prev) => {
          const out = new URLSearchParams(prev);
          if (next > 1) out.set(name, String(next));
          else out.delete(name);
          return out;
        },
        { replace: opts?.replace },
      ),
    [name, setParams],
  );
  return [page, setPage];
}

type PagerProps = {
  page: number;
  total: number;
  limit: number;
  /** names the navigation for screen readers, e.g. "Order pages" */
  label: string;
  /** what the rows are, plural, e.g. "orders" */
  noun: string;
  onPageChange: (page: number) => void;
  className?: string;
};

/**
 * Previous / "Page 2 of 7" / Next under a list. The buttons stay focusable at either end (they
 * say they are unavailable instead of vanishing from the tab order), and the page reached is
 * announced. A page past the end (rows were removed meanwhile) offers the way back to the last.
 */
/** The plural noun a list is counted in ("entries", "cut sheets"), made singular for one: "1 entry". */
export function countNoun(n: number, plural: string): string {
  if (n !== 1) return plural;
  if (plural.endsWith('ies')) return `${plural.slice(0, -3)}y`;
  return plural.endsWith('s') ? plural.slice(0, -1) : plural;
}

export function Pager({ page, total, limit, label, noun, onPageChange, className = '' }: PagerProps) {
  const pages = pageCount(total, limit);
  if (pages <= 1 && page <= 1) return null;
  const canPrev = page > 1;
  const canNext = page < pages;
  const first = Math.min(total, (page - 1) * limit + 1);
  const last = Math.min(total, page * limit);
  const off = 'cursor-not-allowed opacity-60';
  return (
    <nav aria-label={label} className={`flex flex-col gap-2 ${className}`}>
      {page > pages ? (
        <p className="font-semibold text-danger">
          There is no page {page}: the list has {pages} {pages === 1 ? 'page' : 'pages'} now.
        </p>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="secondary" aria-disabled={!canPrev || undefined} className={canPrev ? '' : off} onClick={() => canPrev && onPageChange(Math.min(page - 1, pages))}>
          <span aria-hidden="true">←</span> {page > pages ? `Back to page ${pages}` : 'Previous page'}
        </Button>
        <p aria-live="polite" aria-atomic="true" className="flex flex-col leading-tight">
          <span className="font-bold">
            Page {page} of {pages}
          </span>
          <span className="text-sm text-ink-soft">{page > pages ? `${total} ${countNoun(total, noun)} in all` : `${first}–${last} of ${total} ${countNoun(total, noun)}`}</span>
        </p>
        <Button variant="secondary" aria-disabled={!canNext || undefined} className={canNext ? '' : off} onClick={() => canNext && onPageChange(page + 1)}>
          Next page <span aria-hidden="true">→</span>
        </Button>
      </div>
    </nav>
  );
}

/** A paged list's query (`useList`, e.g. a feature's `useMaterials`) at the page kept in the URL (usePageParam): what PagedResults shows. */
export function usePagedQuery<Q>(useList: (filters: { page: number }) => Q, name?: string) {
  const [page, setPage] = usePageParam(name);
  return { page, setPage, query: useList({ page }) };
}

type PagedQuery<T> = { page: number; setPage: (page: number) => void; query: QueryState<{ items: T[]; total: number; limit: number }> & { isPlaceholderData: boolean } };

/**
 * One page of a paged list's query: its loading and error states (QueryBoundary), then `empty` (its
 * title and a hint at what to do, in a stitched box) when the list has nothing at all; otherwise `children` with the page's items,
 * dimmed while the next page loads, with the pager under them.
 */
export function PagedResults<T>({
  list: { query, page, setPage },
  loading,
  label,
  noun,
  empty,
  children,
}: Pick<PagerProps, 'label' | 'noun'> & {
  /** from usePagedQuery */
  list: PagedQuery<T>;
  /** the spinner's words while the first page is on its way */
  loading: string;
  empty: { title: string; hint: string };
  children: (items: T[]) => ReactNode;
}) {
  return (
    <QueryBoundary query={query} loading={loading}>
      {(data) =>
        data.total === 0 ? (
          <StitchedBox>
            <p className="font-bold">{empty.title}</p>
            <p className="text-ink-soft">{empty.hint}</p>
          </StitchedBox>
        ) : (
          <div className="flex flex-col gap-4">
            <div className={query.isPlaceholderData ? 'opacity-60 transition-opacity' : ''}>{children(data.items)}</div>
            <Pager page={page} total={data.total} limit={data.limit} label={label} noun={noun} onPageChange={setPage} />
          </div>
        )
      }
    </QueryBoundary>
  );
}
