import type { CustomCellRendererProps } from 'ag-grid-react';
import { Link } from 'react-router-dom';
import type { CatalyticRole } from '@shared/schemas/enzyme';
import type { VariantListRowDto, VariantStatus } from '@shared/schemas/variant';
import { paths } from '@/config/paths';
import { flagWords } from '../variant-flags';

/** How a catalytic role is drawn: a theme fill class, a letter (so colour is never alone) and a name. */
export interface RoleBadgeStyle {
  fill: string;
  mark: string;
  label: string;
  darkText: boolean;
}
export type RoleStyles = Record<CatalyticRole, RoleBadgeStyle>;

type CellProps = CustomCellRendererProps<VariantListRowDto>;

export function LabelCell({ data }: CellProps) {
  // A row whose block is still on its way: a placeholder bar, so the grid reads as loading, not empty.
  if (!data) {
    return (
      <span className="inline-block h-3 w-20 animate-pulse rounded-sm bg-paper-300 align-middle">
        <span className="sr-only">Loading</span>
      </span>
    );
  }
  return (
    <Link
      to={paths.variant.href(data.id)}
      className={`font-mono font-semibold text-lagoon-700 underline-offset-2 hover:underline ${data.isParent ? 'italic' : ''}`}
      // The grid moves focus between cells itself; the link stays reachable with Enter on the cell.
      tabIndex={-1}
    >
      {data.label}
    </Link>
  );
}

export function RoleBadge({ role, styles }: { role: CatalyticRole; styles: RoleStyles }) {
  const style = styles[role];
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap">
      <span
        aria-hidden
        className={`inline-flex h-4 min-w-4 items-center justify-center rounded-sm px-0.5 font-mono text-[10px] font-bold ${style.fill} ${style.darkText ? 'text-ink-900' : 'text-white'}`}
      >
        {style.mark}
      </span>
      {style.label}
    </span>
  );
}

export function RolesCell({ data, roleStyles }: CellProps & { roleStyles: RoleStyles }) {
  if (!data) return null;
  if (data.roles.length === 0) return <span className="text-ink-400">{data.isParent ? '' : 'none annotated'}</span>;
  return (
    <span className="flex items-center gap-2.5">
      {data.roles.map((role) => (
        <RoleBadge key={role} role={role} styles={roleStyles} />
      ))}
    </span>
  );
}

const statusMarks: Partial<Record<VariantStatus, string>> = { characterized: '✓', failed: '✕', archived: '▪' };

export function statusLabel(status: VariantStatus): string {
  return status.charAt(0).toUpperCase() + status.slice(1);
}

export function StatusCell({ data }: CellProps) {
  if (!data) return null;
  const mark = statusMarks[data.status];
  const muted = data.status === 'failed' || data.status === 'archived';
  return (
    <span className={muted ? 'text-ink-500' : 'text-ink-900'}>
      {mark && <span aria-hidden className="mr-1">{mark}</span>}
      {statusLabel(data.status)}
    </span>
  );
}

export function FlagsCell({ data }: CellProps) {
  if (!data || data.flags.length === 0) return null;
  return (
    <span className="flex items-center gap-3 text-signal-caution">
      {data.flags.map((code) => {
        const words = flagWords(code);
        return (
          <span key={code} title={words.explanation} className="inline-flex items-center gap-1 whitespace-nowrap">
            <span aria-hidden>⚠</span>
            {words.short}
          </span>
        );
      })}
    </span>
  );
}
