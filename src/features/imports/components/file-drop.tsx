import { useId, useState, type DragEvent } from 'react';
import { FileUp } from 'lucide-react';
import { cn } from '@/lib/cn';

export const SHEET_ACCEPT = '.csv,.tsv,.txt,text/csv,text/tab-separated-values';

/** Pick a results file, or drop one on the box. The file is read here in the browser; nothing is uploaded yet. */
export function FileDrop({ onFile, fileName, error }: { onFile: (file: File) => void; fileName: string | null; error?: string | null }) {
  const id = useId();
  const [over, setOver] = useState(false);
  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    const file = e.dataTransfer.files[0];
    if (file) onFile(file);
  };
  return (
    <div className="flex flex-col gap-2">
      <label
        htmlFor={id}
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={onDrop}
        className={cn(
          'flex min-h-24 cursor-pointer flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed border-line-strong p-4 text-center',
          over && 'border-accent bg-accent-soft',
        )}
      >
        <FileUp aria-hidden="true" className="size-7" />
        <span className="font-bold">Results file (CSV or TSV)</span>
        <span className="text-sm text-ink-muted">
          {!fileName ? 'Tap to choose, or drop the file here' : error ? `“${fileName}” could not be used · choose another` : `Reading “${fileName}” · choose another`}
        </span>
      </label>
      <input
        id={id}
        type="file"
        accept={SHEET_ACCEPT}
        className="sr-only"
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) onFile(file);
          e.target.value = '';
        }}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
}
