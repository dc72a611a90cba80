import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { pressRunSteps, type RunStep } from '../../../../shared/engine/press-run.ts';
import type { PressCardView } from '../../../../shared/schemas/workroom.ts';
import { DesignOnBlank, DesignPieces } from '../../../components/design/design-on-blank.tsx';
import { Spinner } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { usePressCards } from '../../../features/workroom/api/get-press-cards.ts';
import { usePressedOutbox } from '../../../features/workroom/lib/pressed-outbox.ts';
import { isApiError } from '../../../lib/api-client.ts';

/** Heat-press cautions, as the press cards give them. */
const CAUTIONS = 'Heat burns: keep hands clear, use a protective sheet, let the press cool, keep it away from children. Ventilate when pressing vinyl.';

// ---------------------------------------------------------------- the end-of-step signal

let audio: AudioContext | null = null;
/** Made on the first start (a user gesture), so the browser lets it sound later. */
function unlockAudio(): void {
  try {
    audio ??= new AudioContext();
    if (audio.state === 'suspended') void audio.resume();
  } catch {
    audio = null; // no Web Audio: the screen and vibration still tell
  }
}
/** Three short tones, and a vibration where the device can. */
function signalEnd(): void {
  if (audio) {
    const t0 = audio.currentTime;
    for (let i = 0; i < 3; i++) {
      const osc = audio.createOscillator();
      const gain = audio.createGain();
      osc.frequency.value = 880;
      gain.gain.setValueAtTime(0.0001, t0 + i * 0.25);
      gain.gain.exponentialRampToValueAtTime(0.4, t0 + i * 0.25 + 0.02);
      gain.gain.exponentialRampToValueAtTime(0.0001, t0 + i * 0.25 + 0.18);
      osc.connect(gain).connect(audio.destination);
      osc.start(t0 + i * 0.25);
      osc.stop(t0 + i * 0.25 + 0.2);
    }
  }
  navigator.vibrate?.([200, 100, 200, 100, 200]);
}

/** Keeps the screen on while `on` (Wake Lock where supported; asked again when the page is shown again). */
function useWakeLock(on: boolean): void {
  useEffect(() => {
    if (!on || !('wakeLock' in navigator)) return;
    let lock: WakeLockSentinel | null = null;
    let stopped = false;
    const ask = async () => {
      try {
        if (document.visibilityState === 'visible' && !stopped) lock = await navigator.wakeLock.request('screen');
      } catch {
        lock = null; // refused (battery saver, no permission): the run still works
      }
    };
    void ask();
    const again = () => void ask();
    document.addEventListener('visibilitychange', again);
    return () => {
      stopped = true;
      document.removeEventListener('visibilitychange', again);
      void lock?.release();
    };
  }, [on]);
}

// ---------------------------------------------------------------- one item

function Figure({ view, step }: { view: PressCardView; step: RunStep | undefined }) {
  const now = new Set(step?.layerIds ?? []);
  const b = view.figure.blank;
  const current = view.figure.pieces.filter((p) => p.materialId && now.has(p.materialId));
  const rest = view.figure.pieces.filter((p) => !(p.materialId && now.has(p.materialId)));
  return (
    <figure className="flex flex-col gap-2">
      <div className="rounded-lg border border-line bg-paper-deep p-2">
        <DesignOnBlank blank={b} rulers label={`Placement on the ${b.name}, to scale`}>
          <g opacity={now.size ? 0.3 : 1}>
            <DesignPieces pieces={rest} />
          </g>
          <DesignPieces pieces={current} />
        </DesignOnBlank>
      </div>
      <figcaption className="text-lg">{view.card.placementNote}</figcaption>
    </figure>
  );
}

function ItemRun({ view, onDone, position }: { view: PressCardView; onDone: () => Promise<void>; position: string }) {
  const steps = useMemo(() => pressRunSteps(view.card), [view.card]);
  const [at, setAt] = useState(0);
  const [endsAt, setEndsAt] = useState<number | null>(null);
  const [now, setNow] = useState(() => Date.now());
  const [finishing, setFinishing] = useState(false);
  const primary = useRef<HTMLButtonElement>(null);
  const step = steps[at];
  const running = endsAt !== null;
  useWakeLock(true);

  const next = useCallback(async () => {
    setEndsAt(null);
    if (at + 1 < steps.length) {
      setAt(at + 1);
      return;
    }
    setFinishing(true);
    try {
      await onDone();
    } finally {
      setFinishing(false);
    }
  }, [at, steps.length, onDone]);

  // the countdown
  useEffect(() => {
    if (endsAt === null) return;
    const id = window.setInterval(() => setNow(Date.now()), 200);
    return () => window.clearInterval(id);
  }, [endsAt]);
  useEffect(() => {
    if (endsAt !== null && now >= endsAt) {
      signalEnd();
      void next();
    }
  }, [now, endsAt, next]);
  // the big control follows the step, so the space bar and a switch both reach it
  // biome-ignore lint/correctness/useExhaustiveDependencies: focus moves when the step changes
  useEffect(() => primary.current?.focus(), [at]);

  const act = useCallback(() => {
    if (!step || finishing) return;
    if (step.timerS && endsAt === null) {
      unlockAudio();
      const t = Date.now();
      setNow(t);
      setEndsAt(t + step.timerS * 1000);
      return;
    }
    void next();
  }, [step, endsAt, finishing, next]);

  // the space bar starts the step wherever the focus is, unless it is on another control
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.code !== 'Space' && e.key !== ' ') return;
      const el = e.target as HTMLElement | null;
      if (el?.closest('button, a, input, select, textarea, [contenteditable="true"]')) return;
      e.preventDefault();
      act();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [act]);

  if (!step) return null;
  const left = endsAt === null ? (step.timerS ?? 0) : Math.max(0, Math.ceil((endsAt - now) / 1000));
  const label = finishing ? 'Saving…' : step.timerS ? (running ? 'Done early' : `Start ${step.timerS} s`) : at + 1 === steps.length ? 'Done — next item' : 'Done';
  return (
    <div className="grid gap-6 md:grid-cols-[3fr_2fr]">
      <section aria-labelledby="run-step" className="flex flex-col gap-4">
        <p className="text-xl font-bold text-ink-soft">
          {position} · step {at + 1} of {steps.length}
        </p>
        <h2 id="run-step" className="text-5xl leading-tight font-extrabold">
          {step.title}
        </h2>
        {step.tempLabel || step.protectiveSheet ? (
          <p className="flex flex-wrap gap-3 text-2xl font-bold">
            {step.tempLabel ? <span>{step.tempLabel}</span> : null}
            {step.protectiveSheet ? <span className="rounded-lg bg-thread-wash px-3 text-thread-deep">protective sheet</span> : null}
          </p>
        ) : null}
        <p className="text-xl">{step.detail}</p>
        {step.timerS ? (
          <div role="timer" aria-label={`${left} seconds left`} className="text-center text-[7rem] leading-none font-extrabold tabular-nums" data-testid="countdown">
            {left}
            <span className="text-5xl"> s</span>
          </div>
        ) : null}
        <p aria-live="polite" className="sr-only">
          {running ? `${step.title} running` : `${step.title}: ready`}
        </p>
        <button
          ref={primary}
          type="button"
          onClick={act}
          disabled={finishing}
          className={`min-h-28 w-full rounded-lg px-6 text-4xl font-extrabold shadow-sm ${running ? 'bg-ink text-paper' : 'bg-marigold text-ink hover:bg-marigold-light'}`}
        >
          {label}
        </button>
        <p className="text-center text-base text-ink-soft">Space bar: {step.timerS ? (running ? 'end the step now' : 'start the timer') : 'done'}</p>
        <div className="flex flex-wrap gap-3">
          <button type="button" className="min-h-11 rounded-lg border border-line px-4 font-bold" disabled={at === 0 || finishing} onClick={() => (setEndsAt(null), setAt(at - 1))}>
            ← Back a step
          </button>
        </div>
        {view.card.warnings.length ? (
          <ul className="flex flex-col gap-2" aria-label="Press warnings">
            {view.card.warnings.map((w) => (
              <li key={w.code} className="rounded-lg border-2 border-marigold bg-marigold-wash px-3 py-2 text-lg font-semibold">
                ⚠ {w.message}
              </li>
            ))}
          </ul>
        ) : null}
        <ol aria-label="All steps" className="flex flex-col gap-1 text-lg">
          {steps.map((s, i) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: one fixed procedure; the place is the step number
            <li key={i} aria-current={i === at ? 'step' : undefined} className={i === at ? 'font-extrabold' : i < at ? 'text-ink-soft line-through' : ''}>
              {i + 1}. {s.title}
            </li>
          ))}
        </ol>
      </section>
      <aside className="flex flex-col gap-4">
        <Figure view={view} step={step} />
        <p role="note" className="rounded-lg border-2 border-danger bg-white p-3 text-lg font-bold">
          {CAUTIONS}
        </p>
      </aside>
    </div>
  );
}

// ---------------------------------------------------------------- the queue

export function PressRunPage() {
  const cards = usePressCards();
  const outbox = usePressedOutbox();
  const toast = useToast();
  // lines finished on this screen (sent or waiting in the outbox) leave the queue at once
  const [finished, setFinished] = useState<Set<string>>(() => new Set());
  const waiting = new Set(outbox.entries.map((e) => e.lineId));
  // the loaded queue stays in use when a refetch fails (offline): data is kept beside the error
  const queue = (cards.data ?? []).filter((v) => !finished.has(v.line.id) && !waiting.has(v.line.id));
  const total = (cards.data ?? []).length;
  const view = queue[0];

  const done = async () => {
    if (!view) return;
    const label = `${view.line.orderNumber} · ${view.line.text || view.line.listingTitle}`;
    try {
      const how = await outbox.send(view.line.id, label);
      setFinished((f) => new Set(f).add(view.line.id));
      if (how === 'sent') toast.success(`${label} pressed.`);
      else toast.success(`${label} pressed. Saved on this device; it syncs when the connection is back.`);
    } catch (e) {
      toast.error(isApiError(e) ? e.message : 'That did not work.');
    }
  };

  return (
    <div className="fixed inset-0 z-50 overflow-y-auto bg-paper text-ink">
      <header className="sticky top-0 z-10 flex flex-wrap items-center justify-between gap-3 border-b border-line bg-paper px-6 py-3">
        <h1 className="text-2xl font-extrabold">
          Press run
          {view ? (
            <span className="ml-3 font-bold">
              {view.line.orderNumber} · {view.line.text || '—'}
              {view.line.quantity > 1 ? ` × ${view.line.quantity}` : ''}
            </span>
          ) : null}
        </h1>
        <div className="flex items-center gap-4">
          {!outbox.online || outbox.entries.length ? (
            <span role="status" className="rounded-lg bg-marigold-wash px-3 py-1 font-bold">
              {outbox.online ? 'Syncing' : 'Offline'}: {outbox.entries.length} mark{outbox.entries.length === 1 ? '' : 's'} waiting
            </span>
          ) : null}
          <Link to={paths.workroomPress.getHref()} className="min-h-11 content-center rounded-lg border border-line px-4 font-bold">
            Exit
          </Link>
        </div>
      </header>
      <main className="mx-auto max-w-6xl p-6">
        {outbox.refused.length ? (
          <p role="alert" className="mb-4 font-bold text-danger">
            Not saved: {outbox.refused.join('; ')}
          </p>
        ) : null}
        {cards.isPending ? (
          <Spinner label="Loading the press queue…" />
        ) : !cards.data ? (
          <p role="alert" className="text-xl font-bold text-danger">
            {cards.error?.message ?? 'The press queue could not be loaded.'}
          </p>
        ) : view ? (
          <>
            <p className="mb-2 text-lg text-ink-soft">{view.line.listingTitle}</p>
            <ItemRun key={view.line.id} view={view} onDone={done} position={`Item ${total - queue.length + 1} of ${total}`} />
          </>
        ) : (
          <div className="flex flex-col items-start gap-4">
            <p className="text-3xl font-extrabold">Everything in the queue is pressed.</p>
            <Link to={paths.workroom.getHref()} className="text-xl font-bold underline">
              Back to the workroom
            </Link>
          </div>
        )}
      </main>
    </div>
  );
}
