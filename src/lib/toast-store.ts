/**
 * A tiny store for toasts, so that code outside React (the query client's error handlers) can
 * raise one. <Toaster /> renders whatever is here with Radix Toast.
 */
export type ToastTone = 'info' | 'success' | 'warning';

export interface ToastAction {
  /** The button's words, e.g. "Undo". */
  label: string;
  /** Read to people who cannot see the button, e.g. "Undo: restore run 3". */
  altText: string;
  onAction: () => void;
}

export interface ToastMessage {
  id: number;
  title: string;
  description?: string;
  tone: ToastTone;
  /** One button in the toast (an undo); such a toast stays a little longer. */
  action?: ToastAction;
}

type Listener = () => void;

let toasts: readonly ToastMessage[] = [];
let nextId = 1;
const listeners = new Set<Listener>();

function emit() {
  for (const listener of listeners) listener();
}

/** Shows a toast. The same words already on screen are not shown twice. */
export function toast(message: Omit<ToastMessage, 'id'>): number {
  const same = message.action
    ? undefined
    : toasts.find(
        (t) => !t.action && t.title === message.title && t.description === message.description && t.tone === message.tone,
      );
  if (same) return same.id;
  const id = nextId++;
  toasts = [...toasts, { ...message, id }];
  emit();
  return id;
}

export function dismissToast(id: number): void {
  if (!toasts.some((t) => t.id === id)) return;
  toasts = toasts.filter((t) => t.id !== id);
  emit();
}

/** Removes every toast (sign-out, tests). */
export function clearToasts(): void {
  if (toasts.length === 0) return;
  toasts = [];
  emit();
}

export function subscribeToToasts(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function getToasts(): readonly ToastMessage[] {
  return toasts;
}
