import { Link } from 'react-router-dom';
import { DesignOnBlank, pictureOfKind } from '../../components/design/design-on-blank.tsx';
import { ButtonLink } from '../../components/ui/button.tsx';
import { occasions, paths } from '../../config/paths.ts';
import { useMe } from '../../features/auth/api/get-me.ts';
import { OccasionShelves } from './home/occasion-shelves.tsx';

const steps = [
  { title: 'Type the name', body: 'Choose a tote, tee, pouch or drawstring bag and type the name it should carry: Mira, Theo, Bartholomew.' },
  { title: 'See it to scale', body: 'Pick a colour for each layer and a motif. The preview uses the very font the shop will cut, with a ruler in inches and centimetres.' },
  { title: 'The shop checks and presses', body: 'Before cutting, the shop reads the name back letter by letter. Then it cuts, presses and posts it to you.' },
];

export function HomePage() {
  const me = useMe();
  const canOpenShop = me.data?.user.role === 'shopper' && !me.data.shop;

  return (
    <div className="flex flex-col gap-16 sm:gap-20">
      <section aria-labelledby="hero-title" className="grid items-center gap-10 md:grid-cols-[1.15fr_1fr]">
        <div className="flex flex-col gap-6">
          <p className="w-fit rounded-full bg-thread-wash px-3 py-1 text-sm font-bold text-thread-deep">Personalised, pressed by hand</p>
          <h1 id="hero-title" className="text-4xl leading-[1.1] font-black tracking-tight sm:text-5xl">
            Their name, cut in vinyl and pressed to last.
          </h1>
          <p className="max-w-prose text-lg text-ink-soft">
            Namesake brings together small craft studios that decorate tote bags, kids' tees, pouches and drawstring bags with heat transfer vinyl. You type the name and choose the colours; you see
            exactly how it will look before a single letter is cut.
          </p>
          <div className="flex flex-wrap gap-3">
            <ButtonLink to={paths.search.getHref()}>Browse the shops</ButtonLink>
            {canOpenShop || !me.data ? (
              <ButtonLink to={me.data ? paths.openShop.getHref() : paths.auth.signUp.getHref(paths.openShop.getHref())} variant="secondary">
                Sell your own work
              </ButtonLink>
            ) : null}
          </div>
        </div>
        <ToteSketch />
      </section>

      <section aria-labelledby="occasions-title" className="flex flex-col gap-5">
        <div>
          <h2 id="occasions-title" className="text-2xl font-extrabold">
            Find something for the occasion
          </h2>
          <p className="text-ink-soft">Seasonal motifs and colour sets, chosen by each shop.</p>
        </div>
        <ul className="flex flex-wrap gap-3">
          {occasions.map((occasion) => (
            <li key={occasion.slug}>
              <Link
                to={paths.search.getHref({ occasion: occasion.slug })}
                className="flex min-h-11 items-center gap-2 rounded-full border-2 border-thread bg-white px-4 font-bold text-thread-deep hover:bg-thread-wash"
              >
                <span aria-hidden="true" className="size-2.5 rounded-full bg-marigold" />
                {occasion.label}
              </Link>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="how-title" className="flex flex-col gap-6">
        <h2 id="how-title" className="text-2xl font-extrabold">
          How a Namesake order comes together
        </h2>
        <ol className="grid gap-5 md:grid-cols-3">
          {steps.map((step, index) => (
            <li key={step.title} className="flex flex-col gap-2 rounded-lg border border-line bg-white p-6">
              <span aria-hidden="true" className="flex size-9 items-center justify-center rounded-full bg-ink text-lg font-black text-paper">
                {index + 1}
              </span>
              <h3 className="text-lg font-extrabold">{step.title}</h3>
              <p className="text-ink-soft">{step.body}</p>
            </li>
          ))}
        </ol>
      </section>

      <section aria-labelledby="listings-title" className="flex flex-col gap-5">
        <h2 id="listings-title" className="text-2xl font-extrabold">
          Fresh from the workrooms, by occasion
        </h2>
        <OccasionShelves />
      </section>
    </div>
  );
}

/** A simple drawn tote with its print area dashed and a name in it — a hint of the live preview. */
function ToteSketch() {
  return (
    <figure className="mx-auto w-full max-w-sm">
      <DesignOnBlank blank={pictureOfKind('tote')!} rulers label="A drawn tote bag with the name Mira in its dashed print area">
        <circle cx="190" cy="120" r="38" fill="#e0a526" />
        <text x="190" y="235" textAnchor="middle" fontFamily="Nunito Variable, sans-serif" fontWeight="900" fontSize="78" fill="#2f7d6d">
          Mira
        </text>
      </DesignOnBlank>
      <figcaption className="mt-2 text-center text-sm text-ink-soft">Every design is shown to scale on its blank before it is cut.</figcaption>
    </figure>
  );
}
