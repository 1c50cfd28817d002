import { memo, useLayoutEffect, useMemo, useRef, useState, type MouseEvent } from 'react';
import { catalyticRoles, type CatalyticRole } from '@shared/schemas/enzyme';
import { aminoAcidFromOneLetter } from '@shared/sequence/amino-acids';
import { roleStyle } from '../role-style';

export interface SequenceMapSite {
  position: number;
  role: CatalyticRole;
  expectedPka?: number | null;
  /** What the annotator wrote about the residue; shown when it is pointed at. */
  note?: string | null;
}

export interface SequenceMapProps {
  sequence: string;
  sites: readonly SequenceMapSite[];
  /** Positions to highlight (this variant's mutations), with the change shown on hover. */
  mutations?: readonly { position: number; from: string; to: string }[];
  /** Labels of variants that touch each position, for the hover details. */
  variantsByPosition?: ReadonlyMap<number, readonly string[]>;
  /** A position to point out (e.g. the one being typed into a site form); it is ringed and described. */
  highlightPosition?: number;
  /** Residues per numbered block. */
  blockSize?: number;
  /** Blocks per line; by default as many of {@link lineChoices} as fit the width. */
  blocksPerLine?: number;
}

// Blocks per line the map chooses from, widest first: lines of 100, 80, 60 or 50 residues are easy to
// count along; narrower ones only when the screen is.
const lineChoices = [10, 8, 6, 5, 4, 3, 2, 1];

interface ResidueDetails {
  position: number;
  residue: string;
  roles: CatalyticRole[];
  expectedPka: number | null;
  notes: readonly string[];
  mutation?: { from: string; to: string };
  variants: readonly string[];
}

/**
 * The parent sequence in numbered blocks of ten, each line numbered at both ends. Annotated residues carry
 * their role colour and letter; mutated positions are boxed. Pointing at any residue describes it below
 * the map; only marked residues are focusable, so a 1,000-residue map stays a few tab stops.
 */
export function SequenceMap({
  sequence,
  sites,
  mutations = [],
  variantsByPosition,
  highlightPosition,
  blockSize = 10,
  blocksPerLine: fixedBlocksPerLine,
}: SequenceMapProps) {
  const [hovered, setHovered] = useState<number | null>(null);
  const frame = useRef<HTMLDivElement>(null);
  const probe = useRef<HTMLSpanElement>(null);
  const [fittedBlocks, setFittedBlocks] = useState(6);
  const blocksPerLine = fixedBlocksPerLine ?? fittedBlocks;
  const digits = String(sequence.length).length;

  // Measures one block and one line number as rendered, and fits as many blocks as the frame holds.
  useLayoutEffect(() => {
    const container = frame.current;
    const sample = probe.current;
    if (!container || !sample || fixedBlocksPerLine !== undefined) return;
    const measure = () => {
      const block = sample.querySelector<HTMLElement>('[data-probe="block"]')!.getBoundingClientRect().width;
      const number = sample.querySelector<HTMLElement>('[data-probe="number"]')!.getBoundingClientRect().width;
      const style = getComputedStyle(container);
      const inner = container.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
      // Two line numbers with their 1rem gaps, then blocks separated by 0.75rem.
      const rem = parseFloat(getComputedStyle(document.documentElement).fontSize);
      const forBlocks = inner - 2 * (number + rem);
      const fits = lineChoices.find((count) => count * block + (count - 1) * 0.75 * rem <= forBlocks) ?? 1;
      setFittedBlocks(fits);
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(container);
    return () => observer.disconnect();
  }, [fixedBlocksPerLine, blockSize, digits]);

  const rolesByPosition = useMemo(() => {
    const map = new Map<number, CatalyticRole[]>();
    for (const site of sites) map.set(site.position, [...(map.get(site.position) ?? []), site.role]);
    return map;
  }, [sites]);
  const pkaByPosition = useMemo(
    () => new Map(sites.filter((site) => site.expectedPka !== null && site.expectedPka !== undefined).map((site) => [site.position, site.expectedPka!])),
    [sites],
  );
  // A residue annotated in two roles may carry a note for each.
  const notesByPosition = useMemo(() => {
    const map = new Map<number, string[]>();
    for (const site of sites) if (site.note) map.set(site.position, [...(map.get(site.position) ?? []), site.note]);
    return map;
  }, [sites]);
  const mutationByPosition = useMemo(() => new Map(mutations.map((mutation) => [mutation.position, mutation])), [mutations]);

  const lineLength = blockSize * blocksPerLine;
  const lines = useMemo(() => {
    const result: number[] = [];
    for (let start = 0; start < sequence.length; start += lineLength) result.push(start);
    return result;
  }, [sequence.length, lineLength]);

  const validHighlight = highlightPosition !== undefined && highlightPosition >= 1 && highlightPosition <= sequence.length ? highlightPosition : null;
  const active = hovered ?? validHighlight;
  const details: ResidueDetails | null =
    active === null
      ? null
      : {
          position: active,
          residue: sequence[active - 1],
          roles: rolesByPosition.get(active) ?? [],
          expectedPka: pkaByPosition.get(active) ?? null,
          notes: notesByPosition.get(active) ?? [],
          mutation: mutationByPosition.get(active),
          variants: variantsByPosition?.get(active) ?? [],
        };

  const rolesPresent = catalyticRoles.filter((role) => sites.some((site) => site.role === role));

  // One handler for the whole map rather than one per residue: a long sequence has thousands of spans.
  const handlePointer = (event: MouseEvent<HTMLDivElement>) => {
    const target = (event.target as HTMLElement).closest<HTMLElement>('[data-position]');
    if (target) setHovered(Number(target.dataset.position));
  };

  return (
    <figure className="space-y-3">
      <div
        ref={frame}
        className="relative overflow-x-auto rounded-lg border border-paper-200 bg-white px-4 pb-3 pt-4"
        onMouseOver={handlePointer}
        onMouseLeave={() => setHovered(null)}
      >
        <span ref={probe} aria-hidden className="invisible absolute left-0 top-0 flex font-mono text-sm">
          <span data-probe="block">
            {Array.from({ length: blockSize }, (_, index) => (
              <span key={index} className={cell}>
                M
              </span>
            ))}
          </span>
          <span data-probe="number" className="text-xs" style={{ width: `${digits + 1}ch` }} />
        </span>
        <div className="font-mono text-sm leading-8" role="list" aria-label={`Sequence, ${sequence.length} residues`}>
          {lines.map((lineStart) => {
            const lineEnd = Math.min(lineStart + lineLength, sequence.length);
            return (
              <div key={lineStart} className="flex items-baseline gap-4 whitespace-nowrap" role="listitem" aria-label={`Residues ${lineStart + 1} to ${lineEnd}`}>
                <span className="numeric shrink-0 select-none text-xs text-ink-500" style={{ width: `${digits + 1}ch` }} aria-hidden>
                  {lineStart + 1}
                </span>
                <SequenceLine
                  sequence={sequence}
                  lineStart={lineStart}
                  blockSize={blockSize}
                  blocksPerLine={blocksPerLine}
                  rolesByPosition={rolesByPosition}
                  mutationByPosition={mutationByPosition}
                  active={active !== null && active > lineStart && active <= lineEnd ? active : null}
                  onActivate={setHovered}
                />
                <span className="numeric shrink-0 select-none text-xs text-ink-500" style={{ width: `${digits + 1}ch` }} aria-hidden>
                  {lineEnd}
                </span>
              </div>
            );
          })}
        </div>
      </div>
      <div aria-live="polite" className="min-h-10 rounded-md bg-paper-100 px-3 py-2 text-sm">
        {details ? (
          <p>
            <span className="font-mono font-semibold">
              {details.residue}
              {details.position}
            </span>{' '}
            <span className="text-ink-600">({aminoAcidFromOneLetter(details.residue)?.name ?? 'unknown residue'})</span>
            {details.roles.length > 0 && <> · {details.roles.map((role) => roleStyle[role].label).join(', ')}</>}
            {details.expectedPka !== null && <> · expected pKa {details.expectedPka.toFixed(1)}</>}
            {details.notes.length > 0 && <> · <span className="text-ink-700">{details.notes.join('; ')}</span></>}
            {details.mutation && (
              <>
                {' '}
                · mutated here to <span className="font-mono font-semibold">{details.mutation.to}</span>
              </>
            )}
            {details.variants.length > 0 && (
              <>
                {' '}
                · variants here: <span className="font-mono">{details.variants.join(', ')}</span>
              </>
            )}
          </p>
        ) : (
          <p className="text-ink-600">Point at a residue, or tab to a marked one, for its details.</p>
        )}
      </div>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600">
        {rolesPresent.map((role) => (
          <span key={role} className="inline-flex items-center gap-1.5">
            <span
              className={`inline-flex h-4 min-w-4 items-center justify-center rounded-sm px-0.5 font-mono text-[10px] font-bold ${roleStyle[role].fill} ${roleStyle[role].darkText ? 'text-ink-900' : 'text-white'}`}
            >
              {roleStyle[role].mark}
            </span>
            {roleStyle[role].label}
          </span>
        ))}
        {rolesPresent.length === 0 && <span>No catalytic residues annotated.</span>}
        {mutations.length > 0 && (
          <span className="inline-flex items-center gap-1.5">
            <span className="inline-block size-4 rounded-sm border-2 border-ember-500" /> Mutated in this variant
          </span>
        )}
        <span>Blocks of {blockSize}; lines numbered at both ends.</span>
      </figcaption>
    </figure>
  );
}

interface SequenceLineProps {
  sequence: string;
  lineStart: number;
  blockSize: number;
  blocksPerLine: number;
  rolesByPosition: ReadonlyMap<number, CatalyticRole[]>;
  mutationByPosition: ReadonlyMap<number, unknown>;
  /** The active position when it falls on this line, so the other lines need not re-render. */
  active: number | null;
  onActivate: (position: number) => void;
}

const SequenceLine = memo(function SequenceLine({
  sequence,
  lineStart,
  blockSize,
  blocksPerLine,
  rolesByPosition,
  mutationByPosition,
  active,
  onActivate,
}: SequenceLineProps) {
  return (
    <span className="flex gap-3">
      {Array.from({ length: blocksPerLine }, (_, blockIndex) => lineStart + blockIndex * blockSize)
        .filter((blockStart) => blockStart < sequence.length)
        .map((blockStart) => (
          <span key={blockStart}>
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
                  onActivate={onActivate}
                />
              );
            })}
          </span>
        ))}
    </span>
  );
});

// Every residue sits in a cell of the same width, so columns line up across lines whatever is marked.
const cell = 'inline-block w-[1.25ch] text-center leading-6';

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
  if (!roles && !mutated) {
    return (
      <span data-position={position} className={`${cell} ${active ? 'rounded-sm bg-ink-900 text-white' : ''}`}>
        {residue}
      </span>
    );
  }
  const style = roles ? roleStyle[roles[0]] : null;
  const classes = [
    `${cell} relative cursor-default rounded-sm`,
    style ? `${style.fill} ${style.darkText ? 'text-ink-900' : 'text-white'} font-semibold` : '',
    mutated ? 'outline outline-2 outline-offset-1 outline-ember-500' : '',
    active ? 'ring-2 ring-ink-900 ring-offset-1' : '',
  ].join(' ');
  const label = `${residue}${position}${roles ? `, ${roles.map((role) => roleStyle[role].label).join(', ')}` : ''}${mutated ? ', mutated' : ''}`;
  return (
    <span tabIndex={0} role="button" aria-label={label} data-position={position} className={classes} onFocus={() => onActivate(position)}>
      {residue}
      {style && (
        <span aria-hidden className="absolute -top-2.5 left-1/2 -translate-x-1/2 whitespace-nowrap font-sans text-[9px] font-bold leading-none text-ink-700">
          {style.mark}
        </span>
      )}
    </span>
  );
}
