import type { ReactNode } from 'react';

/** A paper panel with a stitched (dashed) inner edge — our print-shop look. */
export function Card({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <div className={`rounded-lg border border-line bg-white p-6 shadow-sm sm:p-8 ${className}`}>{children}</div>;
}

export function PageHeading({ title, lead, eyebrow }: { title: string; lead?: ReactNode; eyebrow?: string }) {
  return (
    <header className="mb-8 flex flex-col gap-2">
      {eyebrow ? <p className="text-sm font-bold tracking-wide text-thread-deep uppercase">{eyebrow}</p> : null}
      <h1 className="text-3xl font-extrabold tracking-tight text-ink sm:text-4xl">{title}</h1>
      {lead ? <div className="max-w-prose text-lg text-ink-soft">{lead}</div> : null}
    </header>
  );
}

export function StitchedBox({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <div className={`rounded-lg border-2 border-dashed border-thread/60 bg-thread-wash/40 p-6 ${className}`}>{children}</div>;
}
