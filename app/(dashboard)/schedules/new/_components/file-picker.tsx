"use client";

import { useId, useState, type DragEvent } from "react";

export type FilePickerProps = { onFile: (file: File) => void; fileName: string | null };

/** Drop a CSV on the area, or use the ordinary file input inside it (keyboard and screen readers). */
export function FilePicker({ onFile, fileName }: FilePickerProps) {
  const inputId = useId();
  const [dragging, setDragging] = useState(false);
  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    const file = event.dataTransfer.files[0];
    if (file) onFile(file);
  };
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      data-testid="drop-zone"
      className={`rounded border-2 border-dashed p-6 text-center ${dragging ? "border-action bg-sheet" : "border-rule bg-sheet/60"}`}
    >
      <p className="font-medium">Drop a CSV file here</p>
      <p className="mt-1 text-ink-soft">or</p>
      {/* The input sits inside its label, so keyboard focus on it outlines the visible button. */}
      <label htmlFor={inputId} className="mt-2 inline-block cursor-pointer rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-action">
        Choose a CSV file
        <input
          id={inputId}
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain"
          className="sr-only"
          aria-label="CSV file"
          onChange={(e) => {
            const file = e.currentTarget.files?.[0];
            if (file) onFile(file);
            // The same file chosen again (after fixing it) must load again.
            e.currentTarget.value = "";
          }}
        />
      </label>
      {fileName ? (
        <p className="mt-3 text-ink-soft [overflow-wrap:anywhere]" data-testid="file-name">
          Loaded: <span className="font-medium text-ink">{fileName}</span>
        </p>
      ) : null}
    </div>
  );
}
