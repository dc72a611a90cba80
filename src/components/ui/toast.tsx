import { createContext, type ReactNode, useCallback, useContext, useMemo, useRef, useState } from 'react';

export type ToastTone = 'error' | 'success' | 'info';
type ToastItem = { id: number; tone: ToastTone; message: string };
type ToastApi = { show: (message: string, tone?: ToastTone) => void; error: (message: string) => void; success: (message: string) => void };

const ToastContext = createContext<ToastApi | null>(null);

const toneClasses: Record<ToastTone, string> = {
  error: 'border-danger bg-danger-wash text-ink',
  success: 'border-thread bg-thread-wash text-ink',
  info: 'border-ink bg-paper text-ink',
};
const toneIcons: Record<ToastTone, string> = { error: '!', success: '✓', info: 'i' };
const toneIconClasses: Record<ToastTone, string> = { error: 'bg-danger text-white', success: 'bg-thread text-white', info: 'bg-ink text-paper' };

export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<ToastItem[]>([]);
  const nextId = useRef(1);

  const dismiss = useCallback((id: number) => setToasts((list) => list.filter((t) => t.id !== id)), []);
  const show = useCallback(
    (message: string, tone: ToastTone = 'info') => {
      const id = nextId.current++;
      // The same message twice in a row (a double click) shows once.
      setToasts((list) => [...list.filter((t) => t.message !== message), { id, tone, message }].slice(-3));
      // Errors stay longer: people need time to read what went wrong.
      window.setTimeout(() => dismiss(id), tone === 'error' ? 9000 : 5000);
    },
    [dismiss],
  );
  const api = useMemo<ToastApi>(() => ({ show, error: (m) => show(m, 'error'), success: (m) => show(m, 'success') }), [show]);

  return (
    <ToastContext.Provider value={api}>
      {children}
      <div role="status" aria-live="polite" aria-label="Notifications" className="pointer-events-none fixed inset-x-0 bottom-0 z-50 flex flex-col items-center gap-2 p-4 sm:items-end">
        {toasts.map((toast) => (
          <div key={toast.id} className={`pointer-events-auto flex w-full max-w-sm items-start gap-3 rounded-lg border-2 p-3.5 shadow-lg ${toneClasses[toast.tone]}`}>
            <span aria-hidden="true" className={`mt-0.5 flex size-6 shrink-0 items-center justify-center rounded-full text-sm font-black ${toneIconClasses[toast.tone]}`}>
              {toneIcons[toast.tone]}
            </span>
            <p className="flex-1 pt-0.5 font-semibold">{toast.message}</p>
            <button type="button" onClick={() => dismiss(toast.id)} className="flex size-8 shrink-0 items-center justify-center rounded-lg text-lg hover:bg-black/5" aria-label="Dismiss notification">
              ×
            </button>
          </div>
        ))}
      </div>
    </ToastContext.Provider>
  );
}

export function useToast(): ToastApi {
  const api = useContext(ToastContext);
  if (!api) throw new Error('useToast must be used inside <ToastProvider>.');
  return api;
}
