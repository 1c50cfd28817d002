import { useMutation } from '@tanstack/react-query';
import type { FastaRecordDto } from '@shared/schemas/enzyme';
import { api } from '@/lib/api-client';

/** Sends FASTA text (pasted, or read from an uploaded file) to the server, which returns every record. */
export const readFasta = async (fasta: string) => (await api.post<{ records: FastaRecordDto[] }>('/enzymes/fasta', { fasta })).records;

export const useReadFasta = () => useMutation({ mutationFn: readFasta });
