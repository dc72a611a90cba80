import { Link } from 'react-router-dom';
import { PageHeading, StitchedBox } from '../../../components/ui/card.tsx';
import { paths } from '../../../config/paths.ts';

export function ModerationDeskPage() {
  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title="New shops and listings" lead="Approve what is ready, or send it back with a reason the seller will receive by e-mail." />
      <div className="grid gap-5 md:grid-cols-2">
        <StitchedBox>
          <h2 className="text-lg font-extrabold">Review queue</h2>
          <p className="mt-1 text-ink-soft">New and edited listings and new shops will line up here.</p>
        </StitchedBox>
        <div className="rounded-lg border border-line bg-white p-6">
          <h2 className="text-lg font-extrabold">Outgoing mail</h2>
          <p className="mt-1 text-ink-soft">Every e-mail Namesake sends in this installation is captured locally, so you can read it.</p>
          <Link to={paths.moderation.mail.getHref()} className="mt-3 inline-flex min-h-11 items-center font-bold text-thread-deep underline decoration-2 underline-offset-4">
            Open the mail viewer
          </Link>
        </div>
      </div>
    </div>
  );
}
