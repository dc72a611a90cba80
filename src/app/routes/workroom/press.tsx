import { Link } from 'react-router-dom';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { QueryPage } from '../../../components/ui/query-boundary.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { usePressCards } from '../../../features/workroom/api/get-press-cards.ts';
import { useMarkPressed } from '../../../features/workroom/api/mark-pressed.ts';
import { PressCardView } from '../../../features/workroom/components/press-card-view.tsx';
import { isApiError } from '../../../lib/api-client.ts';

export function PressPage() {
  const cards = usePressCards();
  const pressed = useMarkPressed();
  const toast = useToast();
  return (
    <QueryPage
      eyebrow="Workroom"
      title="Press cards"
      lead="One card for each cut item: pre-press, layers in press steps from the design (layers that don't overlap go down together; overlapping ones bottom to top), the final press and where to place the design."
      query={cards}
      loading="Loading press cards…"
    >
      {(data) =>
        data.length === 0 ? (
          <p className="text-ink-soft">
            Nothing waiting to be pressed. Cut sheets first:{' '}
            <Link className="underline" to={paths.workroomCutSheets.getHref()}>
              cut sheets
            </Link>
            .
          </p>
        ) : (
          <>
            <p>
              <ButtonLink to={paths.workroomPressRun.getHref()} className="min-h-14 px-6 text-xl">
                Start the press run ({data.length} item{data.length === 1 ? '' : 's'})
              </ButtonLink>
              <span className="ml-3 text-sm text-ink-soft">Full screen, one item at a time, with timers — for a tablet or phone beside the press.</span>
            </p>
            <ul className="grid gap-5 lg:grid-cols-2">
              {data.map(({ line, card }) => (
                <li
                  key={line.id}
                  className="flex flex-col gap-3 rounded-lg border border-line bg-white p-5 shadow-sm"
                  data-testid="press-card"
                  aria-label={`Press card for ${line.text || line.listingTitle}`}
                >
                  <header className="flex flex-wrap items-baseline justify-between gap-2">
                    <h2 className="text-lg font-extrabold">
                      {line.orderNumber} · {line.text || '—'}
                      {line.quantity > 1 ? ` × ${line.quantity}` : ''}
                    </h2>
                    <Link className="text-sm font-bold text-thread-deep underline" to={paths.workroomOrder.getHref(line.orderId)}>
                      order
                    </Link>
                  </header>
                  <p className="text-sm text-ink-soft">
                    {line.listingTitle}
                    {line.blankChoice ? <span className="font-bold text-ink"> · {line.blankChoice}</span> : null}
                  </p>
                  <PressCardView card={card} />
                  <Button
                    variant="secondary"
                    className="self-start"
                    pending={pressed.isPending && pressed.variables?.includes(line.id)}
                    onClick={async () => {
                      try {
                        await pressed.mutateAsync([line.id]);
                        toast.success(`${line.orderNumber} · ${line.text} marked pressed.`);
                      } catch (e) {
                        toast.error(isApiError(e) ? e.message : 'That did not work.');
                      }
                    }}
                  >
                    Mark pressed
                  </Button>
                </li>
              ))}
            </ul>
          </>
        )
      }
    </QueryPage>
  );
}
