import { catalyticRoles } from '@shared/schemas/enzyme';
import { RoleBadge, type RoleStyles } from './variant-cells';

/** The key to the role colours and letters in the grid, always on screen with it. */
export function RoleLegend({ roleStyles }: { roleStyles: RoleStyles }) {
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-700">
      <span className="font-semibold text-ink-600">Catalytic roles:</span>
      <ul className="contents">
        {catalyticRoles.map((role) => (
          <li key={role}>
            <RoleBadge role={role} styles={roleStyles} />
          </li>
        ))}
      </ul>
    </div>
  );
}
