import { useId, useMemo, useRef, useState, type ChangeEvent } from 'react';
import { maxFastaBytes, type FastaRecordDto } from '@shared/schemas/enzyme';
import { parseFasta } from '@shared/sequence/parse-fasta';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { useReadFasta } from '../api/read-fasta';

interface SequenceFieldProps {
  value: string;
  onChange: (value: string) => void;
  /** The server's or the schema's message for the field. */
  error?: string;
}

/** What the field holds, read with the shared FASTA parser as it is typed. */
type Reading = { kind: 'empty' } | { kind: 'problem'; message: string } | { kind: 'one'; length: number; header: string } | { kind: 'several'; records: FastaRecordDto[] };

function read(text: string): Reading {
  if (text.trim() === '') return { kind: 'empty' };
  const parsed = parseFasta(text);
  if (!parsed.ok) return { kind: 'problem', message: parsed.message };
  if (parsed.records.length === 1) return { kind: 'one', length: parsed.records[0].sequence.length, header: parsed.records[0].header };
  return {
    kind: 'several',
    records: parsed.records.map((record) => ({ ...record, length: record.sequence.length })),
  };
}

const asFasta = (record: FastaRecordDto) => (record.header ? `>${record.header}\n${record.sequence}` : record.sequence);

/**
 * The amino-acid sequence: pasted (raw or FASTA) or read from an uploaded FASTA file by the server. When
 * the text holds several records, one is picked and the field keeps only that one.
 */
export function SequenceField({ value, onChange, error }: SequenceFieldProps) {
  const id = useId();
  const fileInput = useRef<HTMLInputElement>(null);
  const readFasta = useReadFasta();
  const [uploaded, setUploaded] = useState<{ name: string; records: FastaRecordDto[] } | null>(null);
  const [uploadProblem, setUploadProblem] = useState<string | null>(null);
  const reading = useMemo(() => read(value), [value]);
  const choices = uploaded?.records ?? (reading.kind === 'several' ? reading.records : null);

  const handleFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = '';
    setUploadProblem(null);
    setUploaded(null);
    if (!file) return;
    if (file.size > maxFastaBytes) {
      setUploadProblem(`${file.name} is larger than ${maxFastaBytes / 1_048_576} MB; a FASTA file of one enzyme is a few kilobytes.`);
      return;
    }
    readFasta.mutate(await file.text(), {
      onSuccess: (records) => {
        if (records.length === 1) onChange(asFasta(records[0]));
        else setUploaded({ name: file.name, records });
      },
      onError: (failure) =>
        setUploadProblem(
          failure instanceof ApiError ? `${file.name}: ${Object.values(failure.fields)[0] ?? failure.message}` : 'The server could not be reached to read the file.',
        ),
    });
  };

  const pick = (record: FastaRecordDto) => {
    setUploaded(null);
    onChange(asFasta(record));
  };

  const message = error ?? (reading.kind === 'problem' ? reading.message : uploadProblem ?? undefined);

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <label htmlFor={id} className="block text-sm font-medium text-ink-700">
          Amino-acid sequence
        </label>
        <div className="flex items-center gap-2">
          <input ref={fileInput} type="file" accept=".fasta,.fa,.faa,.txt,text/plain" className="sr-only" tabIndex={-1} aria-hidden onChange={(event) => void handleFile(event)} />
          <Button className="px-2.5 py-1 text-xs" busy={readFasta.isPending} onClick={() => fileInput.current?.click()}>
            Upload a FASTA file
          </Button>
        </div>
      </div>
      <textarea
        id={id}
        rows={7}
        spellCheck={false}
        value={value}
        onChange={(event) => {
          setUploaded(null);
          setUploadProblem(null);
          onChange(event.target.value);
        }}
        placeholder={'>my-enzyme Invented amidase\nMSKLVEA…'}
        aria-invalid={message ? true : undefined}
        aria-describedby={`${id}-reading`}
        className={`block w-full rounded-md border bg-white px-3 py-2 font-mono text-sm text-ink-900 placeholder:text-ink-400 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200 ${message ? 'border-signal-danger' : 'border-paper-300'}`}
      />
      <div id={`${id}-reading`} aria-live="polite" className="text-sm">
        {message ? (
          <p className="flex items-start gap-1 text-signal-danger">
            <span aria-hidden>⚠</span> {message}
          </p>
        ) : reading.kind === 'one' ? (
          <p className="text-ink-600">
            <span aria-hidden className="text-signal-fine">✓ </span>
            {reading.length} residues{reading.header && <> · {reading.header}</>}
          </p>
        ) : reading.kind === 'empty' ? (
          <p className="text-ink-500">Paste the sequence (one-letter codes, with or without a FASTA header), or upload a FASTA file.</p>
        ) : null}
      </div>
      {choices && (
        <fieldset className="space-y-2 rounded-md border border-lagoon-300 bg-lagoon-50 p-3">
          <legend className="px-1 text-sm font-semibold text-lagoon-900">
            {uploaded ? `${uploaded.name} holds` : 'The text holds'} {choices.length} records: pick the one to use
          </legend>
          <ul className="space-y-1">
            {choices.map((record, index) => (
              <li key={`${record.id}-${index}`} className="flex flex-wrap items-center justify-between gap-2 rounded bg-white px-3 py-2 text-sm">
                <span>
                  <span className="font-mono font-semibold">{record.id || `record ${index + 1}`}</span>
                  {record.description && <span className="text-ink-600"> {record.description}</span>}
                  <span className="ml-2 text-xs text-ink-500">{record.length} residues</span>
                </span>
                <Button className="px-2.5 py-1 text-xs" aria-label={`Use record ${record.id || index + 1}`} onClick={() => pick(record)}>
                  Use this record
                </Button>
              </li>
            ))}
          </ul>
        </fieldset>
      )}
    </div>
  );
}
