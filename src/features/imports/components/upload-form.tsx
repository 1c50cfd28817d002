import { useId, useState, type FormEvent } from 'react';
import { importKindLabels, importKinds, maxImportBytes, maxImportRows, type ImportJobDto, type ImportKind } from '@shared/schemas/import';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { importTemplateUrl } from '../api/export-urls';
import { useUploadImport } from '../api/upload-import';

const kindOptions = importKinds.map((kind) => ({ value: kind, label: importKindLabels[kind] }));

/** Step one: what the file holds, and the file. The server checks the file by its content. */
export function UploadForm({ onUploaded }: { onUploaded: (job: ImportJobDto) => void }) {
  const upload = useUploadImport();
  const [kind, setKind] = useState<ImportKind>('measurements');
  const [file, setFile] = useState<File | null>(null);
  const [missingFile, setMissingFile] = useState(false);
  const fileId = useId();
  const failure = upload.error instanceof ApiError ? upload.error : upload.error ? new ApiError(0, 'network', 'The server could not be reached.') : null;
  const fileProblem = missingFile ? 'Choose a file to import.' : failure?.fields.file;

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) {
      setMissingFile(true);
      return;
    }
    upload.mutate({ kind, file }, { onSuccess: onUploaded });
  };

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <h2 className="text-lg font-semibold">Import a spreadsheet</h2>
      {failure && !failure.fields.file && <Notice tone="danger" title={failure.message} />}
      <SelectField label="The file holds" options={kindOptions} value={kind} onChange={(event) => setKind(event.target.value as ImportKind)} />
      <div className="space-y-1">
        <label htmlFor={fileId} className="block text-sm font-medium text-ink-700">
          File (.xlsx or .csv)
        </label>
        <input
          id={fileId}
          type="file"
          accept=".xlsx,.csv"
          aria-invalid={fileProblem ? true : undefined}
          aria-describedby={`${fileId}-help`}
          onChange={(event) => {
            setFile(event.target.files?.[0] ?? null);
            setMissingFile(false);
            upload.reset();
          }}
          className="block w-full text-sm text-ink-700 file:mr-3 file:rounded-md file:border file:border-paper-300 file:bg-paper-100 file:px-3 file:py-1.5 file:text-sm file:font-medium file:text-ink-900 hover:file:bg-paper-200"
        />
        {fileProblem ? (
          <p id={`${fileId}-help`} className="flex items-center gap-1 text-sm text-signal-danger">
            <span aria-hidden>⚠</span> {fileProblem}
          </p>
        ) : (
          <p id={`${fileId}-help`} className="text-sm text-ink-500">
            At most {maxImportBytes / 1024 / 1024} MB and {maxImportRows.toLocaleString()} rows a sheet. Nothing is written until you commit.
          </p>
        )}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Button type="submit" variant="primary" busy={upload.isPending}>
          Upload
        </Button>
        <a href={importTemplateUrl(kind)} className="text-sm font-medium text-lagoon-700 underline-offset-2 hover:underline" download>
          Download the {importKindLabels[kind].toLowerCase()} template
        </a>
      </div>
    </form>
  );
}
