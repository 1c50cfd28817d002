import { roleLabels } from '@shared/auth/permissions';
import { PageHeader } from '@/components/ui/page-header';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/features/auth/api/get-me';

export default function AboutRoute() {
  const me = useMe();
  return (
    <div className="max-w-3xl space-y-6">
      <PageHeader title="About Kcatalog" description={me.data ? `Signed in as ${me.data.name} (${roleLabels[me.data.role]}).` : undefined} />
      <p>
        Kcatalog is where an enzyme engineering team keeps its variants and their kinetics. Biologists register variants
        as point mutations on a parent enzyme; kineticists attach measurements, from raw initial rates to fitted
        Michaelis–Menten parameters with standard errors; leads review the ranking of variants by ΔΔG‡ against a parent
        measured under matched conditions, and receive it every week by e-mail.
      </p>
      <Notice tone="caution" title="Research use only">
        Fitted values are estimates from the data entered. Kcatalog shows their uncertainty and warnings, but the
        scientist decides. It is not for clinical or diagnostic decisions.
      </Notice>
      <Notice tone="info" title="Laboratory safety">
        Laboratory work with organisms and chemicals follows your institution&apos;s biosafety and chemical-hygiene rules.
      </Notice>
    </div>
  );
}
