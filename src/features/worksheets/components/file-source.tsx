import { Upload } from 'lucide-react';
import { useId, useRef, useState } from 'react';
import { buttonVariants } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import { notTextReason, useWorksheetFiles } from '../lib/worksheet-files';

type FileSourceProps = {
  label: string;
  hint: string;
  value: string;
  onChange: (text: string, fileName: string | null) => void;
  accept?: string;
  rows?: number;
  placeholder?: string;
  /**
   * Takes a chosen file before it is read as text: answers true when it keeps the file itself (a large LandXML
   * surface streamed in a worker), so the page never holds its whole text.
   */
  onFile?: (file: File) => boolean;
};

/** Paste text, or upload a file (read in the browser; nothing leaves it until a tally is saved). */
export function FileSource({
  label,
  hint,
  value,
  onChange,
  accept = '.csv,.txt',
  rows = 6,
  placeholder,
  onFile,
}: FileSourceProps) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const files = useWorksheetFiles();
  const [refused, setRefused] = useState<string | null>(null);
  const attached = files?.attached.get(label);
  const big = value.length > 200_000;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-end justify-between gap-2">
        <label htmlFor={id} className="text-xs font-medium text-stone-700">
          {label}
        </label>
        {files?.readOnly ? null : (
          <label className={cn(buttonVariants({ variant: 'secondary', size: 'sm' }), 'cursor-pointer')}>
            <Upload aria-hidden /> Upload file
            <input
              ref={input}
              type="file"
              aria-label={`Upload a file for ${label}`}
              accept={accept}
              className="sr-only"
              onChange={async (event) => {
                const file = event.target.files?.[0];
                if (input.current) input.current.value = '';
                if (!file) return;
                const why = await notTextReason(file);
                setRefused(why);
                if (why) return;
                files?.attach(label, file);
                if (onFile?.(file)) return;
                onChange(await file.text(), file.name);
              }}
            />
          </label>
        )}
      </div>
      <textarea
        id={id}
        rows={rows}
        spellCheck={false}
        placeholder={placeholder}
        className="w-full rounded-md border border-stone-300 bg-white px-2.5 py-1.5 font-mono text-xs tabular-nums shadow-xs focus-visible:border-spruce-600 focus-visible:outline-spruce-600"
        value={
          big
            ? `${value.slice(0, 2000)}\n… (${value.length.toLocaleString('en-US')} characters; upload again to replace)`
            : value
        }
        readOnly={big || files?.readOnly}
        onChange={(event) => {
          files?.detach(label);
          onChange(event.target.value, null);
        }}
      />
      {refused ? (
        <p role="alert" className="text-xs text-brick-700">
          {refused}. Nothing was read.
        </p>
      ) : null}
      {attached ? <p className="text-xs text-spruce-800">Attached as evidence when saved: {attached.name}</p> : null}
      <p className="text-xs text-stone-500">{hint}</p>
    </div>
  );
}
