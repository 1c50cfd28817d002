import { useCallback, useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import { Notice } from '@/components/ui/notice';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useEnergyUnit } from '@/features/auth/api/update-preferences';
import { EnergyUnitToggle } from '@/features/auth/components/energy-unit-toggle';
import { ExportButtons } from '@/features/imports/components/export-buttons';
import { useCampaignChoices } from '@/features/registry/api/get-campaign-choices';
import { ColumnPicker } from '@/features/registry/components/column-picker';
import { CopyLinkButton } from '@/features/registry/components/copy-link-button';
import { RegistryFilterBar } from '@/features/registry/components/registry-filter-bar';
import { RoleLegend } from '@/features/registry/components/role-legend';
import { VariantList } from '@/features/registry/components/variant-list';
import { parseRegistryView, registryViewSearch, variantListQuery, type RegistryView } from '@/features/registry/registry-view';
import { roleStyle } from '@/features/sequence-map/role-style';

export default function RegistryRoute() {
  const me = useMe();
  const [energyUnit] = useEnergyUnit();
  const campaigns = useCampaignChoices();
  const [searchParams, setSearchParams] = useSearchParams();
  const { view, ignored } = useMemo(() => parseRegistryView(searchParams), [searchParams]);

  // Every change is a new history entry, so back and forward step through the views.
  const showView = useCallback((next: RegistryView) => setSearchParams(new URLSearchParams(registryViewSearch(next))), [setSearchParams]);
  const handleSortChange = useCallback((sort: RegistryView['sort']) => showView({ ...view, sort }), [showView, view]);

  const mayRegister = me.data ? can(me.data.role, 'variants:write') : false;

  return (
    <div className="space-y-4">
      <PageHeader
        title="Registry"
        description={
          // Narrower than the header's default, so the unit, export and register controls stay beside it at 1280 px.
          <span className="block max-w-2xl">
            Every variant with its kinetics against the parent measured under matched conditions. Filters, sort and columns are part of the
            address, so a link shows a colleague the same view.
          </span>
        }
        actions={
          <div className="flex flex-wrap items-center gap-3">
            <EnergyUnitToggle />
            {/* Reading is enough to export (the server asks only for `read`), so every role gets the files. */}
            <ExportButtons query={variantListQuery(view.filters, view.sort)} />
            {mayRegister && (
              <Link
                to={paths.registerVariant.href(view.filters.campaignId)}
                className="inline-flex items-center rounded-md bg-ember-500 px-3.5 py-2 text-sm font-semibold text-white hover:bg-ember-600"
              >
                Register variant
              </Link>
            )}
          </div>
        }
      />
      {ignored.length > 0 && (
        <Notice tone="caution" title="Part of this link could not be read and was left out">
          <ul className="list-disc pl-5">
            {ignored.map((message) => (
              <li key={message}>{message}</li>
            ))}
          </ul>
        </Notice>
      )}
      <RegistryFilterBar
        filters={view.filters}
        campaigns={campaigns.data}
        campaignsFailed={campaigns.isError}
        energyUnit={energyUnit}
        roleStyles={roleStyle}
        onChange={(filters) => showView({ ...view, filters })}
      />
      <VariantList
        view={view}
        energyUnit={energyUnit}
        roleStyles={roleStyle}
        onSortChange={handleSortChange}
        toolbar={
          <div className="flex items-center gap-3">
            <CopyLinkButton />
            <ColumnPicker columns={view.columns} onChange={(columns) => showView({ ...view, columns })} />
          </div>
        }
      />
      <RoleLegend roleStyles={roleStyle} />
    </div>
  );
}
