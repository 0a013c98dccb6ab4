import { useEffect, useId, useRef, type ReactNode } from "react";

// The native modal dialog: focus is held inside, Escape closes it, the page behind is inert.
export function Dialog({
  open,
  onClose,
  title,
  children,
  wide = false,
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  children: ReactNode;
  wide?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby={titleId}
      className={`w-full ${wide ? "max-w-2xl" : "max-w-md"} rounded border border-rule bg-paper p-0 text-ink shadow-xl backdrop:bg-ink/30`}
    >
      {open && (
        <div className="p-5">
          <div className="flex items-start justify-between gap-4">
            <h2 id={titleId} className="text-lg font-semibold tracking-tight">
              {title}
            </h2>
            <button type="button" onClick={onClose} className="text-sm text-ink/60 hover:text-copper" aria-label="Close">
              Close
            </button>
          </div>
          <div className="mt-4">{children}</div>
        </div>
      )}
    </dialog>
  );
}
