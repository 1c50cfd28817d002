import { formatEnergy, formatEnergyFigures, formatFoldChange, formatKcatOverKm } from '@shared/format/numbers';
import { digestFlagLabels, type DigestContentDto, type DigestMoverDto, type DigestRankedVariantDto } from '@shared/schemas/digest';
import { escapeHtml } from '../mail/escape-html';
import { mailButton, mailColors, mailParagraph, renderMailHtml } from '../mail/mail-layout';
import { formatMailDate, formatMailDateTime } from '../mail/mail-options';
import { formatReviewCounts } from './digest-format';

/** Who the rendering is for. */
export interface DigestRecipient {
  name: string;
  /** The one-click unsubscribe link; null in a preview for someone not subscribed. */
  unsubscribeUrl: string | null;
  /** Subscribed as the campaign's lead (by default) rather than by choice. */
  asLead: boolean;
}

const cell = `padding:6px 8px;border-bottom:1px solid ${mailColors.rule};text-align:left;vertical-align:top`;
const numberCell = `${cell};text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap`;
// No text-transform: the headers carry units (kJ/mol) whose case is part of their meaning.
const headCell = `padding:6px 8px;border-bottom:2px solid ${mailColors.rule};text-align:left;font-size:12px;font-weight:600;color:${mailColors.muted}`;
const sectionHeading = `margin:24px 0 8px;font-size:16px`;

/**
 * The subject of a campaign's digest.
 *
 * @param content the digest content
 * @returns e.g. `Weekly ranking: AmdT acid tolerance (1 Jun 2026)`
 */
export function digestSubject(content: DigestContentDto): string {
  return `Weekly ranking: ${content.campaign.name} (${formatMailDate(new Date(content.period.end), content.timezone)})`;
}

/**
 * Renders a digest for one reader as plain text and HTML. Every string that a person entered (campaign
 * name and objective, variant labels, notes, substrate) is escaped in the HTML part.
 *
 * @param content the digest content
 * @param publicUrl the base of links
 * @param recipient the reader
 * @returns subject, text and HTML
 */
export function renderDigest(content: DigestContentDto, publicUrl: string, recipient: DigestRecipient): { subject: string; text: string; html: string } {
  const subject = digestSubject(content);
  const movement = movementByVariant(content);
  return { subject, text: renderText(content, publicUrl, recipient, movement), html: renderHtml(content, publicUrl, recipient, movement) };
}

function movementByVariant(content: DigestContentDto): Map<number, string> {
  const movement = new Map<number, string>();
  if (!content.movers.since) return movement;
  for (const move of content.movers.up) movement.set(move.variantId, `▲ up ${(move.previousRank ?? 0) - (move.rank ?? 0)}`);
  for (const move of content.movers.down) if (move.rank !== null) movement.set(move.variantId, `▼ down ${move.rank - (move.previousRank ?? 0)}`);
  for (const move of content.movers.new) movement.set(move.variantId, '★ new');
  for (const entry of content.ranking) if (!movement.has(entry.variantId)) movement.set(entry.variantId, '= same');
  return movement;
}

function statesText(content: DigestContentDto): string {
  return content.reviewStates.join(' and ');
}

function introText(content: DigestContentDto): string {
  return (
    `Variants ranked by ΔΔG‡ for kcat/Km against the parent measured under matched conditions (same substrate, within 0.5 °C and 0.1 pH), ` +
    `counting ${statesText(content)} measurements. Negative ΔΔG‡ = faster than the parent. ` +
    `Target: ${content.campaign.targetSubstrate}, pH ${content.campaign.targetPh}, ${content.campaign.targetTemperatureC} °C.`
  );
}

function moverText(move: DigestMoverDto): string {
  const from = move.previousRank === null ? '–' : `#${move.previousRank}`;
  const to = move.rank === null ? 'unranked' : `#${move.rank}`;
  return `${move.label} (${from} → ${to})`;
}

function footerText(content: DigestContentDto, recipient: DigestRecipient): string {
  const why = recipient.asLead
    ? `You receive this weekly digest as the lead of ${content.campaign.name}.`
    : `You receive this weekly digest because you subscribed to ${content.campaign.name}.`;
  return recipient.unsubscribeUrl ? `${why} Unsubscribe with one click: ${recipient.unsubscribeUrl}` : why;
}

function renderText(content: DigestContentDto, publicUrl: string, recipient: DigestRecipient, movement: Map<number, string>): string {
  const zone = content.timezone;
  const lines: string[] = [
    `${content.campaign.name}: weekly ranking`,
    `Week to ${formatMailDateTime(new Date(content.period.end), zone)}`,
    '',
    introText(content),
    '',
  ];
  if (content.ranking.length === 0) {
    lines.push('No variant has a ΔΔG‡ for kcat/Km against a matched parent yet.', '');
  } else {
    lines.push(`TOP ${content.ranking.length} OF ${content.rankedCount} RANKED VARIANTS`);
    const header = ['#', 'Variant', 'ΔΔG‡ kJ/mol', 'kcat/Km vs parent', 'n', 'Review', ...(content.movers.since ? ['Since last'] : [])];
    const rows = content.ranking.map((entry) => [
      String(entry.rank),
      entry.label,
      `${formatEnergyFigures(entry.ddgKjPerMol.value, entry.ddgKjPerMol.se, 'kJ/mol')}${entry.clearOfParent ? '' : ' *'}`,
      entry.foldChange ? formatFoldChange(entry.foldChange.value) : '—',
      String(entry.n),
      formatReviewCounts(entry.reviewStates),
      ...(content.movers.since ? [movement.get(entry.variantId) ?? ''] : []),
    ]);
    lines.push(...table([header, ...rows]));
    if (content.ranking.some((entry) => !entry.clearOfParent)) lines.push('* within error of the parent (|ΔΔG‡| < 1.96 SE)');
    for (const entry of content.ranking.filter((item) => item.notes)) lines.push(`  ${entry.label}: ${entry.notes}`);
    lines.push('');
  }
  if (content.unmatchedCount > 0) lines.push(`${content.unmatchedCount} measured variant(s) have no condition-matched parent comparison and are not ranked.`, '');

  if (content.movers.since) {
    lines.push(`RANK MOVERS SINCE ${formatMailDate(new Date(content.movers.since.at), zone).toUpperCase()}`);
    lines.push(`  Up: ${content.movers.up.map(moverText).join('; ') || 'none'}`);
    lines.push(`  Down: ${content.movers.down.map(moverText).join('; ') || 'none'}`);
    lines.push(`  New in the top ${content.topCount}: ${content.movers.new.map(moverText).join('; ') || 'none'}`);
  } else {
    lines.push('RANK MOVERS', '  This is the first digest of this campaign; movers appear from the next one.');
  }
  lines.push('', 'THIS WEEK');
  lines.push(`  ${content.addedVariants.total} variant(s) added${content.addedVariants.items.length > 0 ? ':' : '.'}`);
  for (const item of content.addedVariants.items) lines.push(`    ${item.label} (${item.status})${item.notes ? ` – ${item.notes}` : ''}`);
  lines.push(...moreText(content.addedVariants, '    '));
  lines.push(`  ${content.addedMeasurements.total} measurement(s) added${content.addedMeasurements.total > 0 ? ` (${formatReviewCounts(content.addedMeasurements.byState)})` : ''}${content.addedMeasurements.items.length > 0 ? ':' : '.'}`);
  for (const item of content.addedMeasurements.items) {
    lines.push(`    ${item.label}: ${item.kcatOverKmPerMolarSecond === null ? 'no kcat/Km' : `kcat/Km ${formatKcatOverKm(item.kcatOverKmPerMolarSecond)}`}, ${item.reviewState}`);
  }
  lines.push(...moreText(content.addedMeasurements, '    '));
  lines.push('', `WAITING FOR REVIEW (${content.awaitingReview.total})`);
  if (content.awaitingReview.total === 0) lines.push('  Nothing is waiting.');
  for (const item of content.awaitingReview.items) lines.push(`  ${item.label}, measurement ${item.measurementId}, submitted ${formatMailDate(new Date(item.since), zone)}`);
  lines.push(...moreText(content.awaitingReview, '  '));
  lines.push('', `FLAGS (${content.flags.total} variant(s))`);
  if (content.flags.total === 0) lines.push('  No flags.');
  for (const item of content.flags.items) lines.push(`  ${item.label}: ${item.codes.map(flagLabel).join('; ')}`);
  lines.push(...moreText(content.flags, '  '));
  lines.push('', `Registry view: ${publicUrl}${content.registryPath}`, '', '--', footerText(content, recipient), 'Fitted values are estimates; the scientist decides.');
  return `${lines.join('\n')}\n`;
}

/** "… and 12 more" under a list that shows only the first items. */
function moreCount(list: { total: number; items: readonly unknown[] }): number {
  return list.total - list.items.length;
}

function moreText(list: { total: number; items: readonly unknown[] }, indent: string): string[] {
  return moreCount(list) > 0 ? [`${indent}… and ${moreCount(list)} more in the registry`] : [];
}

function table(rows: string[][]): string[] {
  const widths = rows[0].map((_, column) => Math.max(...rows.map((row) => [...row[column]].length)));
  return rows.map((row) => `  ${row.map((value, column) => value.padEnd(widths[column] + value.length - [...value].length)).join('  ').trimEnd()}`);
}

function flagLabel(code: string): string {
  return digestFlagLabels[code] ?? code;
}

function variantLink(publicUrl: string, variantId: number, label: string): string {
  return `<a href="${escapeHtml(`${publicUrl}/variants/${variantId}`)}" style="color:${mailColors.link};font-family:'IBM Plex Mono',ui-monospace,monospace">${escapeHtml(label)}</a>`;
}

function rankingRow(entry: DigestRankedVariantDto, publicUrl: string, movement: Map<number, string>, withMovement: boolean): string {
  const energy = `${escapeHtml(formatEnergyFigures(entry.ddgKjPerMol.value, entry.ddgKjPerMol.se, 'kJ/mol'))}${entry.clearOfParent ? '' : ' <span title="within error of the parent">*</span>'}`;
  const conditions = `${escapeHtml(entry.substrate)}, ${entry.temperatureC} °C, pH ${entry.ph}`;
  const flags = entry.flags.length === 0 ? '' : `<div style="font-size:12px;color:${mailColors.danger}">⚠ ${escapeHtml(entry.flags.map(flagLabel).join('; '))}</div>`;
  const notes = entry.notes ? `<div style="font-size:12px;color:${mailColors.muted}">${escapeHtml(entry.notes)}</div>` : '';
  return `<tr>
<td style="${numberCell}">${entry.rank}</td>
<td style="${cell}">${variantLink(publicUrl, entry.variantId, entry.label)}<div style="font-size:12px;color:${mailColors.muted}">${conditions}</div>${notes}${flags}</td>
<td style="${numberCell}">${energy}</td>
<td style="${numberCell}">${entry.foldChange ? escapeHtml(formatFoldChange(entry.foldChange.value)) : '—'}</td>
<td style="${numberCell}">${entry.n}</td>
<td style="${cell};white-space:nowrap">${escapeHtml(formatReviewCounts(entry.reviewStates))}</td>
${withMovement ? `<td style="${cell};white-space:nowrap">${escapeHtml(movement.get(entry.variantId) ?? '')}</td>` : ''}
</tr>`;
}

function list(items: string[], empty: string, more = 0): string {
  if (items.length === 0) return mailParagraph(`<span style="color:${mailColors.muted}">${escapeHtml(empty)}</span>`);
  const rest = more > 0 ? `<li style="margin:2px 0;color:${mailColors.muted}">… and ${more} more in the registry</li>` : '';
  return `<ul style="margin:0 0 12px;padding-left:20px">${items.map((item) => `<li style="margin:2px 0">${item}</li>`).join('')}${rest}</ul>`;
}

function moverHtml(move: DigestMoverDto, publicUrl: string): string {
  const from = move.previousRank === null ? '–' : `#${move.previousRank}`;
  const to = move.rank === null ? 'unranked' : `#${move.rank}`;
  return `${variantLink(publicUrl, move.variantId, move.label)} ${escapeHtml(`${from} → ${to}`)}`;
}

function renderHtml(content: DigestContentDto, publicUrl: string, recipient: DigestRecipient, movement: Map<number, string>): string {
  const zone = content.timezone;
  const withMovement = content.movers.since !== null;
  const parts: string[] = [
    mailParagraph(`<span style="color:${mailColors.muted}">Week to ${escapeHtml(formatMailDateTime(new Date(content.period.end), zone))}</span>`),
    mailParagraph(escapeHtml(introText(content))),
  ];

  parts.push(`<h2 style="${sectionHeading}">Top ${content.ranking.length} of ${content.rankedCount} ranked variants</h2>`);
  if (content.ranking.length === 0) {
    parts.push(mailParagraph('No variant has a ΔΔG‡ for kcat/Km against a matched parent yet.'));
  } else {
    parts.push(`<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="border-collapse:collapse;font-size:14px">
<tr><th style="${headCell}">#</th><th style="${headCell}">Variant</th><th style="${headCell};text-align:right">ΔΔG‡ kJ/mol</th><th style="${headCell};text-align:right">kcat/Km vs parent</th><th style="${headCell};text-align:right">n</th><th style="${headCell}">Review</th>${withMovement ? `<th style="${headCell}">Since last</th>` : ''}</tr>
${content.ranking.map((entry) => rankingRow(entry, publicUrl, movement, withMovement)).join('\n')}
</table>`);
    if (content.ranking.some((entry) => !entry.clearOfParent)) {
      parts.push(`<p style="margin:6px 0 0;font-size:12px;color:${mailColors.muted}">* within error of the parent (|ΔΔG‡| &lt; 1.96 SE)</p>`);
    }
  }
  if (content.unmatchedCount > 0) {
    parts.push(mailParagraph(`<span style="font-size:13px;color:${mailColors.muted}">${content.unmatchedCount} measured variant(s) have no condition-matched parent comparison and are not ranked.</span>`));
  }

  parts.push(`<h2 style="${sectionHeading}">Rank movers</h2>`);
  if (content.movers.since) {
    parts.push(mailParagraph(`<span style="color:${mailColors.muted}">Since the digest of ${escapeHtml(formatMailDate(new Date(content.movers.since.at), zone))}.</span>`));
    parts.push(
      list(
        [
          `<strong>▲ Up:</strong> ${content.movers.up.map((move) => moverHtml(move, publicUrl)).join('; ') || 'none'}`,
          `<strong>▼ Down:</strong> ${content.movers.down.map((move) => moverHtml(move, publicUrl)).join('; ') || 'none'}`,
          `<strong>★ New in the top ${content.topCount}:</strong> ${content.movers.new.map((move) => moverHtml(move, publicUrl)).join('; ') || 'none'}`,
        ],
        '',
      ),
    );
  } else {
    parts.push(mailParagraph('This is the first digest of this campaign; movers appear from the next one.'));
  }

  parts.push(`<h2 style="${sectionHeading}">This week</h2>`);
  parts.push(mailParagraph(`<strong>${content.addedVariants.total}</strong> variant(s) added`));
  parts.push(
    list(
      content.addedVariants.items.map(
        (item) => `${variantLink(publicUrl, item.variantId, item.label)} (${escapeHtml(item.status)})${item.notes ? ` – <span style="color:${mailColors.muted}">${escapeHtml(item.notes)}</span>` : ''}`,
      ),
      'None.',
      moreCount(content.addedVariants),
    ),
  );
  const byState = content.addedMeasurements.total > 0 ? ` (${escapeHtml(formatReviewCounts(content.addedMeasurements.byState))})` : '';
  parts.push(mailParagraph(`<strong>${content.addedMeasurements.total}</strong> measurement(s) added${byState}`));
  parts.push(
    list(
      content.addedMeasurements.items.map(
        (item) =>
          `${variantLink(publicUrl, item.variantId, item.label)}: ${escapeHtml(item.kcatOverKmPerMolarSecond === null ? 'no kcat/Km' : `kcat/Km ${formatKcatOverKm(item.kcatOverKmPerMolarSecond)}`)}, ${escapeHtml(item.reviewState)}`,
      ),
      'None.',
      moreCount(content.addedMeasurements),
    ),
  );

  parts.push(`<h2 style="${sectionHeading}">Waiting for review (${content.awaitingReview.total})</h2>`);
  parts.push(
    list(
      content.awaitingReview.items.map(
        (item) => `${variantLink(publicUrl, item.variantId, item.label)}, measurement ${item.measurementId}, submitted ${escapeHtml(formatMailDate(new Date(item.since), zone))}`,
      ),
      'Nothing is waiting.',
      moreCount(content.awaitingReview),
    ),
  );

  parts.push(`<h2 style="${sectionHeading}">Flags (${content.flags.total} variant(s))</h2>`);
  parts.push(list(content.flags.items.map((item) => `${variantLink(publicUrl, item.variantId, item.label)}: ⚠ ${escapeHtml(item.codes.map(flagLabel).join('; '))}`), 'No flags.', moreCount(content.flags)));
  parts.push(mailButton(`${publicUrl}${content.registryPath}`, 'Open the registry view'));

  const footer = [
    escapeHtml(recipient.asLead ? `You receive this weekly digest as the lead of ${content.campaign.name}.` : `You receive this weekly digest because you subscribed to ${content.campaign.name}.`),
    recipient.unsubscribeUrl ? `<a href="${escapeHtml(recipient.unsubscribeUrl)}" style="color:${mailColors.link}">Unsubscribe with one click</a>.` : '',
    'Fitted values are estimates; the scientist decides.',
  ]
    .filter(Boolean)
    .join(' ');
  return renderMailHtml({
    title: `${content.campaign.name}: weekly ranking`,
    preheader: content.ranking[0] ? `Top variant: ${content.ranking[0].label} (ΔΔG‡ ${formatEnergy(content.ranking[0].ddgKjPerMol.value, content.ranking[0].ddgKjPerMol.se, 'kJ/mol')})` : 'No ranked variants yet.',
    bodyHtml: parts.join('\n'),
    footerHtml: footer,
  });
}
