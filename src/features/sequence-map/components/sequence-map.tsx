import { useMemo, useState } from 'react';
import { catalyticRoles, type CatalyticRole } from '@shared/schemas/enzyme';
import { roleStyle } from '../role-style';

export interface SequenceMapSite {
  position: number;
  role: CatalyticRole;
  expectedPka?: number | null;
}

export interface SequenceMapProps {
  sequence: string;
  sites: readonly SequenceMapSite[];
  /** Positions to highlight (this variant's mutations), with the change shown on hover. */
  mutations?: readonly { position: number; from: string; to: string }[];
  /** Labels of variants that touch each position, for the hover details. */
  variantsByPosition?: ReadonlyMap<number, readonly string[]>;
  /** Residues per numbered block and blocks per line. */
  blockSize?: number;
  blocksPerLine?: number;
}

interface ResidueDetails {
  position: number;
  residue: string;
  roles: CatalyticRole[];
  mutation?: { from: string; to: string };
  variants: readonly string[];
}

/**
 * The parent sequence in numbered blocks. Annotated residues carry their role colour and letter;
 * mutated positions are boxed. Only marked residues are focusable, so a 1,000-residue map stays a few
 * tab stops; hovering or focusing one shows its details below the map.
 */
export function SequenceMap({ sequence, sites, mutations = [], variantsByPosition, blockSize = 10, blocksPerLine = 6 }: SequenceMapProps) {
  const [active, setActive] = useState<number | null>(null);

  const rolesByPosition = useMemo(() => {
    const map = new Map<number, CatalyticRole[]>();
    for (const site of sites) map.set(site.position, [...(map.get(site.position) ?? []), site.role]);
    return map;
  }, [sites]);
  const mutationByPosition = useMemo(() => new Map(mutations.map((mutation) => [mutation.position, mutation])), [mutations]);

  const lineLength = blockSize * blocksPerLine;
  const lines = useMemo(() => {
    const result: number[] = [];
    for (let start = 0; start < sequence.length; start += lineLength) result.push(start);
    return result;
  }, [sequence.length, lineLength]);

  const details: ResidueDetails | null =
    active === null
      ? null
      : {
          position: active,
          residue: sequence[active - 1],
          roles: rolesByPosition.get(active) ?? [],
          mutation: mutationByPosition.get(active),
          variants: variantsByPosition?.get(active) ?? [],
        };

  const rolesPresent = catalyticRoles.filter((role) => sites.some((site) => site.role === role));

  return (
    <figure className="space-y-3">
      <div className="overflow-x-auto rounded-lg border border-paper-200 bg-white p-4" onMouseLeave={() => setActive(null)}>
        <div className="font-mono text-sm leading-7" role="list" aria-label={`Sequence, ${sequence.length} residues`}>
          {lines.map((lineStart) => (
            <div key={lineStart} className="flex gap-4 whitespace-nowrap" role="listitem">
              <span className="numeric w-12 shrink-0 select-none text-ink-400">{lineStart + 1}</span>
              <span className="flex gap-3">
                {Array.from({ length: blocksPerLine }, (_, blockIndex) => lineStart + blockIndex * blockSize)
                  .filter((blockStart) => blockStart < sequence.length)
                  .map((blockStart) => (
                    <span key={blockStart} className="tracking-wider">
                      {Array.from(sequence.slice(blockStart, blockStart + blockSize)).map((residue, offset) => {
                        const position = blockStart + offset + 1;
                        return (
                          <Residue
                            key={position}
                            residue={residue}
                            position={position}
                            roles={rolesByPosition.get(position)}
                            mutated={mutationByPosition.has(position)}
                            active={active === position}
                            onActivate={setActive}
                          />
                        );
                      })}
                    </span>
                  ))}
              </span>
            </div>
          ))}
        </div>
      </div>
      <div aria-live="polite" className="min-h-10 rounded-md bg-paper-100 px-3 py-2 text-sm">
        {details ? (
          <p>
            <span className="font-mono font-semibold">
              {details.residue}
              {details.position}
            </span>
            {details.roles.length > 0 && <> · {details.roles.map((role) => roleStyle[role].label).join(', ')}</>}
            {details.mutation && (
              <>
                {' '}
                · mutated here to <span className="font-mono font-semibold">{details.mutation.to}</span>
              </>
            )}
            {details.variants.length > 0 && <> · variants: <span className="font-mono">{details.variants.join(', ')}</span></>}
          </p>
        ) : (
          <p className="text-ink-500">Point at or tab to a marked residue for its details.</p>
        )}
      </div>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600">
        {rolesPresent.map((role) => (
          <span key={role} className="inline-flex items-center gap-1.5">
            <span className={`inline-flex h-4 min-w-4 items-center justify-center rounded-sm px-0.5 font-mono text-[10px] font-bold ${roleStyle[role].fill} ${roleStyle[role].darkText ? 'text-ink-900' : 'text-white'}`}>
              {roleStyle[role].mark}
            </span>
            {roleStyle[role].label}
          </span>
        ))}
        {mutations.length > 0 && (
          <span className="inline-flex items-center gap-1.5">
            <span className="inline-block size-4 rounded-sm border-2 border-ember-500" /> Mutated in this variant
          </span>
        )}
      </figcaption>
    </figure>
  );
}

function Residue({
  residue,
  position,
  roles,
  mutated,
  active,
  onActivate,
}: {
  residue: string;
  position: number;
  roles?: CatalyticRole[];
  mutated: boolean;
  active: boolean;
  onActivate: (position: number) => void;
}) {
  if (!roles && !mutated) return <span>{residue}</span>;
  const style = roles ? roleStyle[roles[0]] : null;
  const classes = [
    'relative inline-block rounded-sm px-px cursor-default',
    style ? `${style.fill} ${style.darkText ? 'text-ink-900' : 'text-white'} font-semibold` : '',
    mutated ? 'outline outline-2 outline-ember-500' : '',
    active ? 'ring-2 ring-ink-900' : '',
  ].join(' ');
  const label = `${residue}${position}${roles ? `, ${roles.map((role) => roleStyle[role].label).join(', ')}` : ''}${mutated ? ', mutated' : ''}`;
  return (
    <span
      tabIndex={0}
      role="button"
      aria-label={label}
      className={classes}
      onMouseEnter={() => onActivate(position)}
      onFocus={() => onActivate(position)}
    >
      {residue}
      {style && (
        <span aria-hidden className="absolute -top-2.5 left-0 font-sans text-[8px] font-bold leading-none text-ink-700">
          {style.mark}
        </span>
      )}
    </span>
  );
}
