import { useEffect, useId, useState } from 'react';
import type { WorksheetRequest } from '../../../../shared/schemas/workroom.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useWorksheetJob } from '../api/get-worksheet-job.ts';
import { useStartWorksheet } from '../api/start-worksheet.ts';

type Saved = { jobId: string; paper: NonNullable<WorksheetRequest['paper']> };
const savedKey = (batchId: string) => `namesake:worksheet:${batchId}`;

function readSaved(batchId: string): Saved | null {
  try {
    const v = JSON.parse(sessionStorage.getItem(savedKey(batchId)) ?? 'null') as Saved | null;
    return v && typeof v.jobId === 'string' && (v.paper === 'A4' || v.paper === 'Letter') ? v : null;
  } catch {
    return null;
  }
}

function writeSaved(batchId: string, v: Saved | null) {
  try {
    if (v) sessionStorage.setItem(savedKey(batchId), JSON.stringify(v));
    else sessionStorage.removeItem(savedKey(batchId));
  } catch {
    // storage full or blocked: the link just won't survive a reload
  }
}

/** Builds the batch's work sheet PDF on the server, shows how far it has got, then offers it. */
export function WorksheetDownload({ batchId }: { batchId: string }) {
  const id = useId();
  const toast = useToast();
  // the last work sheet built for this batch is remembered for the tab, so a reload keeps its link
  const saved = readSaved(batchId);
  const [paper, setPaper] = useState<NonNullable<WorksheetRequest['paper']>>(saved?.paper ?? 'A4');
  const [jobId, setJobIdState] = useState<string | null>(saved?.jobId ?? null);
  const setJobId = (next: string | null) => {
    setJobIdState(next);
    writeSaved(batchId, next ? { jobId: next, paper } : null);
  };
  const start = useStartWorksheet();
  const job = useWorksheetJob(jobId);
  const j = job.data;
  // a remembered sheet the server no longer has (a restart, an old tab): offer to build it again
  const gone = job.isError && !j;
  useEffect(() => {
    if (gone) {
      setJobIdState(null);
      writeSaved(batchId, null);
    }
  }, [gone, batchId]);
  const building = !!jobId && !gone && (!j || j.state === 'running');
  const onBuild = async () => {
    try {
      setJobId((await start.mutateAsync({ batchId, paper })).id);
    } catch (e) {
      toast.error(isApiError(e) ? e.message : 'The work sheet could not be started.');
    }
  };
  const pct = Math.round((j?.progress ?? 0) * 100);
  return (
    <section aria-labelledby={`${id}-t`} className="flex flex-col gap-3 rounded-lg border border-line bg-white p-5 shadow-sm">
      <h3 id={`${id}-t`} className="text-lg font-extrabold">
        Work sheet (PDF)
      </h3>
      <p className="text-sm text-ink-soft">Summary, a map of each cut sheet, a press card per item, cautions, care cards for the parcels and a packing slip per order.</p>
      <fieldset className="flex flex-wrap gap-4">
        <legend className="mb-1 font-bold">Paper</legend>
        {(['A4', 'Letter'] as const).map((p) => (
          <label key={p} className="inline-flex min-h-11 items-center gap-2">
            <input
              type="radio"
              name={`${id}-paper`}
              className="size-5 accent-thread"
              checked={paper === p}
              onChange={() => {
                setPaper(p);
                setJobId(null);
              }}
            />
            {p === 'A4' ? 'A4 (210 × 297 mm)' : 'Letter (8.5 × 11 in)'}
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={onBuild} pending={start.isPending || building} pendingLabel="Building…">
          Build the work sheet
        </Button>
        {j?.state === 'done' && j.downloadUrl ? (
          <a href={j.downloadUrl} download className="inline-flex min-h-11 items-center rounded-lg border-2 border-thread px-4 font-bold text-thread-deep hover:bg-thread-wash">
            Download the PDF ({j.pages} pages, {paper})
          </a>
        ) : null}
      </div>
      {jobId && j?.state !== 'done' ? (
        <div className="flex flex-col gap-1">
          <div role="progressbar" aria-label="Building the work sheet" aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-3 w-full overflow-hidden rounded-full bg-paper-deep">
            <div className="h-full bg-thread transition-[width]" style={{ width: `${pct}%` }} />
          </div>
          <p className="text-sm text-ink-soft" aria-live="polite">
            {j?.state === 'failed' ? j.error : `${pct} % of ${j?.pages ?? '…'} pages`}
          </p>
        </div>
      ) : null}
    </section>
  );
}
