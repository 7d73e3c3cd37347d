import { useEffect, useId, useRef, type ReactNode } from "react";

export interface DialogProps {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
}

/** A modal dialog on the native <dialog> element (focus trap and Escape come built in). */
export function Dialog({ open, title, onClose, children }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  // The close event also fires when the parent closes the dialog; only a close by the person
  // (Escape) is reported, or a parent moving on to another dialog would be undone.
  const closedByParent = useRef(false);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) {
      closedByParent.current = true;
      dialog.close();
    }
  }, [open]);

  const reportClose = () => {
    if (closedByParent.current) closedByParent.current = false;
    else onClose();
  };

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={reportClose}
      className="m-auto w-[min(40rem,calc(100vw-2rem))] rounded-lg border-2 border-ink-300 bg-white p-0 text-ink-950 shadow-xl"
    >
      {open && (
        <div className="flex flex-col gap-4 p-6">
          <h2 id={titleId} className="text-2xl font-bold">
            {title}
          </h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
