import { useState, type DragEvent, type ReactNode } from 'react';

/**
 * The dashed area files can be dropped on (highlighted while something is dragged over it), the one copy behind
 * every upload island. Its children say what to drop and hold the keyboard's way in (a "Choose files…" button).
 */
export default function DropZone({
  onFiles,
  className,
  idle = 'border-line',
  children,
}: {
  onFiles: (files: FileList) => void;
  /** Padding and text classes of this use. */
  className: string;
  /** The border and background while nothing is dragged over. */
  idle?: string;
  children: ReactNode;
}) {
  const [over, setOver] = useState(false);
  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    if (e.dataTransfer.files.length) onFiles(e.dataTransfer.files);
  };
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      className={`rounded-lg border-2 border-dashed ${className} ${over ? 'border-accent bg-accent-soft' : idle}`}
    >
      {children}
    </div>
  );
}
