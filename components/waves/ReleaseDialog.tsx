"use client";

import { useEffect, useRef } from "react";

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** What releasing does, in the words of the button and of the question before it. */
export function releaseWords(batchCount: number, unbatchedCount: number): { button: string; question: string } {
  const orders = plural(unbatchedCount, "order", "orders");
  if (batchCount === 0) {
    return {
      button: `Hand all ${orders} back to open`,
      question: `No order of this wave could be batched, so there is nothing for the pickers. Close the wave and hand its ${orders} back to open orders, with the reasons kept on the orders page?`,
    };
  }
  const batches = plural(batchCount, "batch", "batches");
  if (unbatchedCount === 0)
    return {
      button: "Release to pickers",
      question: `Release ${batches} to the pickers' handhelds? Every order of the wave is in a batch; none goes back to open. Released batches are locked: a batch nobody has started can still be recalled.`,
    };
  return {
    button: `Release ${batches}; ${orders} back to open`,
    question: `Release ${batches} to the pickers' handhelds? The ${orders} no batch holds ${unbatchedCount === 1 ? "goes" : "go"} back to open orders, with ${unbatchedCount === 1 ? "its reason" : "their reasons"} kept on the orders page, to go in a later wave once fixed. Released batches are locked.`,
  };
}

/**
 * The question before release, as a modal dialog: focus moves into it (on "Not yet", so Enter does not
 * release by accident), Escape closes it, and focus returns to the button that opened it.
 */
export function ReleaseDialog({
  open,
  batchCount,
  unbatchedCount,
  busy,
  onConfirm,
  onClose,
}: {
  open: boolean;
  batchCount: number;
  unbatchedCount: number;
  busy: boolean;
  onConfirm: () => void;
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const cancelRef = useRef<HTMLButtonElement>(null);
  const words = releaseWords(batchCount, unbatchedCount);

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) {
      d.showModal();
      cancelRef.current?.focus();
    } else if (!open && d.open) d.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      role="alertdialog"
      aria-modal="true"
      aria-labelledby="release-title"
      aria-describedby="release-question"
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border-2 border-rack-light bg-paper-raised p-5 text-ink shadow-lg backdrop:bg-ink/40"
    >
      <h2 id="release-title" className="mb-3">
        {batchCount === 0 ? "Close the wave?" : "Release the wave?"}
      </h2>
      <p id="release-question">{words.question}</p>
      {batchCount > 0 && (
        <ul className="mt-3 list-disc pl-5 text-sm" aria-label="What release does">
          <li>{plural(batchCount, "batch goes", "batches go")} to pickers.</li>
          <li>
            {plural(unbatchedCount, "order", "orders")} not in any batch {unbatchedCount === 1 ? "goes" : "go"} back to
            open.
          </li>
        </ul>
      )}
      <div className="mt-4 flex flex-wrap gap-2">
        <button type="button" className="btn-primary" onClick={onConfirm} disabled={busy}>
          {batchCount === 0 ? "Yes, hand them back" : "Yes, release"}
        </button>
        <button type="button" ref={cancelRef} className="btn-quiet" onClick={onClose}>
          Not yet
        </button>
      </div>
    </dialog>
  );
}
