import { useId, useRef } from 'react';
import { attachmentExtensions, maxAttachmentBytes, maxAttachmentsPerUpload } from '@shared/schemas/attachment';
import { Button } from '@/components/ui/button';

/** Why a file cannot be attached, checked before upload with the server's own limits; null when it can. */
export function fileProblem(file: File): string | null {
  const extension = file.name.includes('.') ? file.name.split('.').pop()!.toLowerCase() : '';
  if (!(attachmentExtensions as readonly string[]).includes(extension)) {
    return `${file.name}: .${extension || '(no extension)'} files are not accepted; use ${attachmentExtensions.map((item) => `.${item}`).join(', ')}`;
  }
  if (file.size === 0) return `${file.name} is empty`;
  if (file.size > maxAttachmentBytes) return `${file.name} is larger than ${maxAttachmentBytes / 1_048_576} MB`;
  return null;
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1_048_576) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / 1_048_576).toFixed(1)} MB`;
}

/** Raw instrument files chosen to go with the assay; they are uploaded once the assay is saved. */
export function FilePicker({ files, onChange, disabled = false }: { files: readonly File[]; onChange: (files: File[]) => void; disabled?: boolean }) {
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  const problems = files.map(fileProblem).filter((problem): problem is string => problem !== null);
  const tooMany = files.length > maxAttachmentsPerUpload;
  return (
    <div className="space-y-2">
      <label htmlFor={id} className="block text-sm font-medium text-ink-700">
        Plate-reader files
      </label>
      <input
        ref={input}
        id={id}
        type="file"
        multiple
        disabled={disabled}
        accept={attachmentExtensions.map((item) => `.${item}`).join(',')}
        onChange={(event) => {
          onChange([...files, ...Array.from(event.target.files ?? [])]);
          event.target.value = '';
        }}
        className="block text-sm file:mr-3 file:rounded-md file:border file:border-paper-300 file:bg-white file:px-3 file:py-1.5 file:text-sm file:font-semibold hover:file:bg-paper-100"
      />
      <p className="text-xs text-ink-500">
        Up to {maxAttachmentsPerUpload} files of at most {maxAttachmentBytes / 1_048_576} MB ({attachmentExtensions.map((item) => `.${item}`).join(', ')}), stored with their SHA-256.
      </p>
      {files.length > 0 && (
        <ul className="space-y-1 text-sm">
          {files.map((file, index) => (
            <li key={`${file.name}-${index}`} className="flex items-center justify-between gap-2 rounded border border-paper-200 px-2 py-1">
              <span className="truncate font-mono text-xs">{file.name}</span>
              <span className="flex items-center gap-2 text-xs text-ink-500">
                {formatBytes(file.size)}
                <Button variant="quiet" className="px-2 py-0.5 text-xs" disabled={disabled} onClick={() => onChange(files.filter((_, other) => other !== index))} aria-label={`Remove ${file.name}`}>
                  Remove
                </Button>
              </span>
            </li>
          ))}
        </ul>
      )}
      {(problems.length > 0 || tooMany) && (
        <ul className="space-y-0.5 text-sm text-signal-danger">
          {tooMany && <li>⚠ Choose at most {maxAttachmentsPerUpload} files.</li>}
          {problems.map((problem) => (
            <li key={problem}>⚠ {problem}.</li>
          ))}
        </ul>
      )}
    </div>
  );
}
