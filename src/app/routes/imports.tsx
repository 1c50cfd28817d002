import { Link, useNavigate, useParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useImportJob } from '@/features/imports/api/get-import-job';
import { useImportJobs } from '@/features/imports/api/get-import-jobs';
import { ImportHistory } from '@/features/imports/components/import-history';
import { ImportWorkspace } from '@/features/imports/components/import-workspace';
import { UploadForm } from '@/features/imports/components/upload-form';

function ImportJobPage({ id }: { id: number }) {
  const job = useImportJob(id);
  return (
    <div>
      <PageHeader
        title="Import"
        description="Choose the sheet and the column of each field, check every row, then commit. The work goes on in the server: you may leave this page and come back."
        actions={
          <Link to={paths.imports.href()} className="rounded-md border border-paper-300 bg-white px-3 py-1.5 text-sm font-semibold text-ink-900 hover:bg-paper-100">
            All imports
          </Link>
        }
      />
      {job.isPending && <LoadingState label="Loading the import…" />}
      {job.isError && <ErrorState error={job.error} onRetry={() => void job.refetch()} />}
      {job.data && <ImportWorkspace job={job.data} />}
    </div>
  );
}

function ImportsHome() {
  const navigate = useNavigate();
  const jobs = useImportJobs();
  return (
    <div>
      <PageHeader
        title="Imports"
        description="Bring variants, fitted measurements, raw rate points or pH series in from .xlsx or .csv files. Importing a file again changes nothing: rows are matched to what is registered."
      />
      <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
        <UploadForm onUploaded={(job) => navigate(paths.importJob.href(job.id))} />
        <section aria-labelledby="history-heading" className="space-y-3">
          <h2 id="history-heading" className="text-lg font-semibold">
            History
          </h2>
          {jobs.isPending && <LoadingState label="Loading imports…" />}
          {jobs.isError && <ErrorState error={jobs.error} onRetry={() => void jobs.refetch()} />}
          {jobs.data && jobs.data.length === 0 && <EmptyState title="No imports yet.">Upload a file to start one.</EmptyState>}
          {jobs.data && jobs.data.length > 0 && <ImportHistory jobs={jobs.data} />}
        </section>
      </div>
    </div>
  );
}

export default function ImportsRoute() {
  const { id } = useParams();
  const jobId = id === undefined ? null : Number(id);
  if (jobId !== null && (!Number.isSafeInteger(jobId) || jobId < 1)) {
    return <ErrorState error={new Error('That is not the address of an import.')} />;
  }
  return jobId === null ? <ImportsHome /> : <ImportJobPage key={jobId} id={jobId} />;
}
