/**
 * Marks "pressed" that survive a lost connection. The press run sends each mark at once; when the
 * network is down it keeps the mark in localStorage (this outbox) and sends it again when the
 * browser is back online (or the run opens again). A mark the server refuses for good (the line
 * was refunded, or is pressed already) leaves the outbox and is reported; one that could not reach
 * the server stays.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useState } from 'react';
import { api, isApiError } from '../../../lib/api-client.ts';
import { workroomKeys } from '../api/keys.ts';

const KEY = 'namesake.pressed-outbox.v1';
export type OutboxEntry = { lineId: string; label: string; at: number };

function read(): OutboxEntry[] {
  try {
    const v = JSON.parse(localStorage.getItem(KEY) ?? '[]');
    return Array.isArray(v) ? v.filter((e): e is OutboxEntry => typeof e?.lineId === 'string' && typeof e?.label === 'string').slice(0, 500) : [];
  } catch {
    return [];
  }
}
function write(list: OutboxEntry[]): void {
  try {
    if (list.length) localStorage.setItem(KEY, JSON.stringify(list));
    else localStorage.removeItem(KEY);
  } catch {
    // storage full or blocked: the mark is still held in memory for this page
  }
}

const post = (lineId: string) => api.post(`/api/workroom/lines/${encodeURIComponent(lineId)}/pressed`, {}, { redirectOn401: false });
const unreachable = (e: unknown) => isApiError(e) && e.status === 0;

/** The outbox as React state, with send (now or later) and a flush on reconnect. */
export function usePressedOutbox() {
  const qc = useQueryClient();
  const [entries, setEntries] = useState<OutboxEntry[]>(read);
  const [online, setOnline] = useState(() => navigator.onLine);
  const [refused, setRefused] = useState<string[]>([]);

  const flush = useCallback(async () => {
    let list = read();
    if (!list.length) return;
    const gone: string[] = [];
    for (const e of [...list]) {
      try {
        await post(e.lineId);
      } catch (err) {
        if (unreachable(err)) break; // still offline: keep this one and the rest
        gone.push(`${e.label}: ${isApiError(err) ? err.message : 'refused'}`);
      }
      list = list.filter((x) => x.lineId !== e.lineId);
      write(list);
    }
    setEntries(read());
    if (gone.length) setRefused((r) => [...r, ...gone]);
    qc.invalidateQueries({ queryKey: workroomKeys.all });
  }, [qc]);

  useEffect(() => {
    const up = () => {
      setOnline(true);
      void flush();
    };
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    void flush();
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, [flush]);

  /** Sends the mark now, or keeps it for later when the server can't be reached. */
  const send = useCallback(async (lineId: string, label: string): Promise<'sent' | 'queued'> => {
    const queue = () => {
      const list = [...read().filter((e) => e.lineId !== lineId), { lineId, label, at: Date.now() }];
      write(list);
      setEntries(list);
      return 'queued' as const;
    };
    if (!navigator.onLine) return queue();
    try {
      await post(lineId);
      return 'sent';
    } catch (e) {
      if (unreachable(e)) return queue();
      throw e;
    }
  }, []);

  return { entries, online, refused, send, flush };
}
