"use client";

import { createContext, useContext, useEffect, useId, useRef } from "react";

/** The open dialog's way out, for the Cancel button its content shows (see `DialogCancel`). */
const DialogClose = createContext<(() => void) | null>(null);

/**
 * A modal built on the native <dialog>: focus is trapped by the browser, Escape, × and the
 * Cancel button inside close it, and focus goes back to the control that opened it.
 */
export function Dialog({
  open,
  title,
  onClose,
  children,
  wide = false,
}: {
  open: boolean;
  title: string;
  onClose: () => void;
  children: React.ReactNode;
  wide?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const opener = useRef<HTMLElement | null>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      opener.current = document.activeElement instanceof HTMLElement ? document.activeElement : null;
      dialog.showModal();
    }
    if (!open && dialog.open) dialog.close();
    if (!open && opener.current) {
      // Not every browser puts focus back on close; a keyboard user would otherwise start over at the top.
      const back = opener.current;
      opener.current = null;
      if (back.isConnected) back.focus();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className={`m-auto w-[calc(100%-2rem)] rounded-lg border border-line bg-white p-0 text-ink shadow-xl backdrop:bg-ink/40 ${
        wide ? "max-w-3xl" : "max-w-lg"
      }`}
    >
      {open && (
        <div className="p-5">
          <div className="mb-4 flex items-start justify-between gap-4">
            <h2 id={titleId} className="text-lg font-bold">
              {title}
            </h2>
            <button
              type="button"
              className="rounded px-2 text-xl leading-none text-ink-soft hover:text-ink"
              aria-label="Close"
              onClick={onClose}
            >
              ×
            </button>
          </div>
          <DialogClose.Provider value={onClose}>{children}</DialogClose.Provider>
        </div>
      )}
    </dialog>
  );
}

/**
 * The visible way out at the foot of a dialog, beside its main button; nothing outside a dialog.
 * `label` is "Done" where nothing typed would be lost (a message to read, settings saved one by one).
 */
export function DialogCancel({ label = "Cancel", onCancel }: { label?: string; onCancel?: () => void }) {
  const close = useContext(DialogClose);
  const cancel = onCancel ?? close;
  if (!cancel) return null;
  return (
    <button type="button" className="btn-quiet" onClick={cancel}>
      {label}
    </button>
  );
}
