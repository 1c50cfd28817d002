import { cofactorLabels, type EnzymeDto } from '@shared/schemas/enzyme';
import { formatDateTime } from '@/lib/format';

/** The enzyme's identity as a list of terms. */
export function EnzymeDetails({ enzyme }: { enzyme: EnzymeDto }) {
  const cofactors = [...enzyme.cofactors.map((cofactor) => cofactorLabels[cofactor]), ...(enzyme.otherCofactors ? [enzyme.otherCofactors] : [])];
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
      <dt className="text-ink-600">EC number</dt>
      <dd className="font-mono">{enzyme.ecNumber ?? '—'}</dd>
      <dt className="text-ink-600">Accession</dt>
      <dd className="font-mono">{enzyme.accession ?? <span className="font-sans text-ink-500">none</span>}</dd>
      <dt className="text-ink-600">Organism</dt>
      <dd>{enzyme.organism}</dd>
      <dt className="text-ink-600">Cofactors</dt>
      <dd>{cofactors.length > 0 ? cofactors.join(', ') : <span className="text-ink-500">none</span>}</dd>
      <dt className="text-ink-600">Length</dt>
      <dd>
        <span className="font-mono tabular-nums">{enzyme.sequenceLength}</span> residues
      </dd>
      <dt className="text-ink-600">Changed</dt>
      <dd>
        {formatDateTime(enzyme.updatedAt)} <span className="text-ink-500">(version {enzyme.version})</span>
      </dd>
    </dl>
  );
}
