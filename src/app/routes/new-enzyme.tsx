import { useNavigate } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { CreateEnzymeForm } from '@/features/enzymes/components/create-enzyme-form';
import { SequenceMap } from '@/features/sequence-map/components/sequence-map';

export default function NewEnzymeRoute() {
  const navigate = useNavigate();
  return (
    <div className="max-w-5xl">
      <PageHeader
        title="New enzyme"
        description="A parent enzyme for campaigns. Paste the sequence or upload a FASTA file; annotated catalytic residues are checked against it as you type."
      />
      <CreateEnzymeForm
        onCreated={(enzyme) => navigate(paths.enzyme.href(enzyme.id))}
        renderPreview={({ sequence, sites, highlightPosition }) => <SequenceMap sequence={sequence} sites={sites} highlightPosition={highlightPosition} />}
      />
    </div>
  );
}
