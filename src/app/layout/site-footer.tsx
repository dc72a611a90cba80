export function SiteFooter() {
  return (
    <footer className="border-t border-line bg-paper-deep">
      <div className="mx-auto grid max-w-6xl gap-6 px-4 py-8 text-sm text-ink-soft sm:grid-cols-2 sm:px-6">
        <div>
          <p className="font-extrabold text-ink">Namesake</p>
          <p className="mt-1 max-w-sm">A marketplace for small craft studios who press names and motifs onto bags, tees and pouches in heat transfer vinyl.</p>
        </div>
        <div>
          <p className="font-extrabold text-ink">Caring for a pressed design</p>
          <p className="mt-1 max-w-sm">Wait 24 hours before the first wash. Wash inside out on a cool setting, no bleach, and never iron over the design.</p>
        </div>
      </div>
    </footer>
  );
}
