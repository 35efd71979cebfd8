import { createContext, useCallback, useContext, useMemo, useState, type ReactNode } from 'react';
import { cx } from '#src/lib/cx.ts';

type Tone = 'info' | 'success' | 'error';
type Toast = { id: number; tone: Tone; message: string };
type ToastApi = { show(message: string, tone?: Tone): void };

const ToastContext = createContext<ToastApi | null>(null);
const toneClasses: Record<Tone, string> = {
  info: 'border-graphite-200 bg-white text-graphite-900',
  success: 'border-moss-600 bg-moss-100 text-moss-800',
  error: 'border-rust-600 bg-rust-100 text-rust-800',
};

/** Short notices in a corner, announced politely to screen readers; errors stay longer. */
export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const dismiss = useCallback((id: number) => setToasts((all) => all.filter((t) => t.id !== id)), []);
  const show = useCallback(
    (message: string, tone: Tone = 'info') => {
      const id = Date.now() + Math.random();
      setToasts((all) => [...all.slice(-3), { id, tone, message }]);
      setTimeout(() => dismiss(id), tone === 'error' ? 8000 : 4000);
    },
    [dismiss],
  );
  const api = useMemo(() => ({ show }), [show]);
  return (
    <ToastContext.Provider value={api}>
      {children}
      <div aria-live="polite" className="pointer-events-none fixed bottom-4 right-4 z-50 flex w-80 flex-col gap-2">
        {toasts.map((toast) => (
          <div
            key={toast.id}
            role={toast.tone === 'error' ? 'alert' : 'status'}
            className={cx(
              'pointer-events-auto flex items-start gap-3 rounded-lg border px-4 py-3 text-sm shadow-md',
              toneClasses[toast.tone],
            )}
          >
            <p className="flex-1">{toast.message}</p>
            <button type="button" onClick={() => dismiss(toast.id)} className="font-bold opacity-60 hover:opacity-100" aria-label="Dismiss">
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
  if (!api) throw new Error('useToast needs a ToastProvider above it');
  return api;
}
