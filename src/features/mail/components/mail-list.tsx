import { Link } from 'react-router-dom';
import { Spinner } from '../../../components/ui/button.tsx';
import { Pager, usePageParam } from '../../../components/ui/pager.tsx';
import { paths } from '../../../config/paths.ts';
import { useMailMessages } from '../api/get-mail-messages.ts';
import { formatMailDate } from './format-date.ts';

export function MailList({ selectedId }: { selectedId: string | null }) {
  const [page, setPage] = usePageParam();
  const messages = useMailMessages({ page });

  if (messages.isPending) return <Spinner label="Loading mail…" />;
  if (messages.isError)
    return (
      <p role="alert" className="font-semibold text-danger">
        {messages.error.message}
      </p>
    );
  if (messages.data.total === 0) {
    return <p className="rounded-lg border-2 border-dashed border-line p-6 text-center text-ink-soft">No mail captured yet. A password reset or an order will put one here.</p>;
  }

  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-2" aria-label="Captured messages">
        {messages.data.items.map((m) => {
          const selected = m.id === selectedId;
          return (
            <li key={m.id}>
              <Link
                to={paths.moderation.mail.getHref(m.id, page)}
                aria-current={selected ? 'true' : undefined}
                className={`flex flex-col gap-0.5 rounded-lg border-2 px-4 py-3 ${selected ? 'border-thread bg-thread-wash' : 'border-line bg-white hover:border-thread'}`}
              >
                <span className="font-bold break-words">{m.subject || '(no subject)'}</span>
                <span className="text-sm break-all text-ink-soft">To {m.to}</span>
                <span className="text-sm text-ink-soft">{formatMailDate(m.date)}</span>
              </Link>
            </li>
          );
        })}
      </ul>
      <Pager page={page} total={messages.data.total} limit={messages.data.limit} label="Mail pages" noun="messages" onPageChange={setPage} />
    </div>
  );
}
