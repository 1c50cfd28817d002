import type { DataSource, EntityManager } from 'typeorm';
import type { PersonRefDto } from '@shared/schemas/campaign';
import { mutationKey, parentHgvs, parentLabel } from '@shared/mutations/format-mutations';
import { parseMutations } from '@shared/mutations/parse-mutations';
import { catalyticRoles, type CatalyticRole } from '@shared/schemas/enzyme';
import {
  parentVariantStatus,
  type CreateVariantInput,
  type TouchedSiteDto,
  type UpdateVariantInput,
  type VariantDto,
  type VariantRefDto,
  type VariantStatus,
  type VariantStatusChangeDto,
} from '@shared/schemas/variant';
import { HttpError, badRequest, notFound, staleVersion } from '../../http/errors';
import { isoFromSqlite } from '../../sqlite-datetime';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { Campaign } from '../campaigns/campaign.entity';
import { celsiusFromKelvin } from '../campaigns/campaign-temperature';
import { Enzyme } from '../enzymes/enzyme.entity';
import { variantColumns, withMutations, type VariantRecord } from './list-variants';
import { Mutation } from './mutation.entity';
import { Variant } from './variant.entity';

/** Audit entity type of variants; status changes are recorded with the action `status`. */
export const variantAuditType = 'variant';

// How many children the variant page lists; `childCount` gives the rest.
const childrenShown = 100;

/**
 * Inserts a campaign's parent variant (the empty mutation set, label `parent`) and its audit event,
 * inside the caller's transaction. Its status is {@link parentVariantStatus}.
 */
export async function insertParentVariant(manager: EntityManager, actorId: number, campaign: Campaign): Promise<Variant> {
  const repository = manager.getRepository(Variant);
  const variant = await repository.save(
    repository.create({
      campaignId: campaign.id,
      enzymeId: campaign.enzymeId,
      parentVariantId: null,
      label: parentLabel,
      hgvs: parentHgvs,
      mutationKey: mutationKey([]),
      mutationCount: 0,
      firstPosition: null,
      constructId: null,
      status: parentVariantStatus,
      notes: null,
      createdById: actorId,
    }),
  );
  await recordAudit(manager, {
    actorId,
    entityType: variantAuditType,
    entityId: variant.id,
    campaignId: campaign.id,
    action: 'create',
    after: variantSnapshot(variant),
  });
  return variant;
}

/**
 * Registers a variant: the mutation text is parsed against the campaign's parent sequence (every
 * problem is a 400 on `mutations`), the set must be new in the campaign (409 naming the existing
 * variant) and not empty (the campaign has its parent already). Variant, mutations and audit event
 * are written in one transaction.
 */
export async function createVariant(dataSource: DataSource, actorId: number, input: CreateVariantInput): Promise<VariantDto> {
  return writeTransaction(dataSource, async (manager) => {
    const campaign = await manager
      .getRepository(Campaign)
      .findOne({ where: { id: input.campaignId }, select: { id: true, enzymeId: true, status: true, name: true } });
    if (!campaign) throw badRequest(`There is no campaign with id ${input.campaignId}.`, { campaignId: `no campaign has id ${input.campaignId}` });
    if (campaign.status === 'closed') {
      const message = `campaign ${campaign.name} is closed; reopen it to register variants`;
      throw badRequest(`The ${message}.`, { campaignId: message });
    }
    const enzyme = await manager.getRepository(Enzyme).findOne({ where: { id: campaign.enzymeId }, select: { id: true, sequence: true } });
    if (!enzyme) throw notFound('The campaign’s enzyme');

    const parsed = parseMutations(input.mutations, { parentSequence: enzyme.sequence });
    if (!parsed.ok) {
      const summary = parsed.problems.map((problem) => `${problem.token}: ${problem.message}`).join('; ');
      throw new HttpError(400, 'validation_error', `The mutations could not be read: ${summary}.`, { mutations: summary }, { problems: parsed.problems });
    }
    const { mutations, label, hgvs } = parsed.value;
    const repository = manager.getRepository(Variant);
    const key = mutationKey(mutations);
    if (mutations.length === 0) {
      const parent = await repository.findOne({ where: { campaignId: campaign.id, mutationKey: key }, select: { id: true } });
      const message = `names no substitution: that is the parent, which the campaign already has${parent ? ` (variant ${parent.id})` : ''}`;
      throw badRequest(`The mutations ${message}.`, { mutations: message });
    }
    const existing = await repository.findOne({ where: { campaignId: campaign.id, mutationKey: key }, select: { id: true, label: true } });
    if (existing) {
      throw new HttpError(
        409,
        'duplicate_variant',
        `${existing.label} is already registered in this campaign as variant ${existing.id}.`,
        { mutations: `duplicates variant ${existing.id} (${existing.label})` },
        { existingVariantId: existing.id, label: existing.label },
      );
    }
    if (input.parentVariantId !== undefined && input.parentVariantId !== null) {
      await checkLineageParent(manager, campaign.id, input.parentVariantId);
    }

    const variant = await repository.save(
      repository.create({
        campaignId: campaign.id,
        enzymeId: campaign.enzymeId,
        parentVariantId: input.parentVariantId ?? null,
        label,
        hgvs,
        mutationKey: key,
        mutationCount: mutations.length,
        firstPosition: mutations[0].position,
        constructId: input.constructId ?? null,
        status: input.status,
        notes: input.notes ?? null,
        createdById: actorId,
      }),
    );
    await manager.insert(
      Mutation,
      mutations.map((mutation) => ({ variantId: variant.id, position: mutation.position, fromResidue: mutation.from, toResidue: mutation.to })),
    );
    await recordAudit(manager, {
      actorId,
      entityType: variantAuditType,
      entityId: variant.id,
      campaignId: campaign.id,
      action: 'create',
      after: variantSnapshot(variant),
    });
    return loadVariantDto(manager, variant.id);
  });
}

/** One variant with its mutations, campaign, lineage, touched sites and status history; 404 when none. */
export async function getVariant(dataSource: DataSource, id: number): Promise<VariantDto> {
  return loadVariantDto(dataSource.manager, id);
}

/**
 * Changes a variant's status, construct id, notes or lineage, refusing a stale version. The lineage
 * parent must be another variant of the same campaign and must not descend from this one.
 */
export async function updateVariant(dataSource: DataSource, actorId: number, id: number, input: UpdateVariantInput): Promise<VariantDto> {
  return writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(Variant);
    const variant = await repository.findOneBy({ id });
    if (!variant) throw notFound('The variant');
    if (variant.version !== input.version) throw staleVersion('This variant', variant.version);
    const before = variantSnapshot(variant);

    if (input.parentVariantId !== undefined && input.parentVariantId !== null && input.parentVariantId !== variant.parentVariantId) {
      if (variant.mutationCount === 0) {
        const message = 'the campaign’s parent variant is the root of its lineage and has no parent';
        throw badRequest(`The ${message}.`, { parentVariantId: message });
      }
      if (input.parentVariantId === variant.id) throw badRequest('A variant cannot be its own parent.', { parentVariantId: 'cannot be the variant itself' });
      await checkLineageParent(manager, variant.campaignId, input.parentVariantId);
      await refuseLineageCycle(manager, variant, input.parentVariantId);
    }

    if (input.status !== undefined) variant.status = input.status;
    if (input.constructId !== undefined) variant.constructId = input.constructId;
    if (input.notes !== undefined) variant.notes = input.notes;
    if (input.parentVariantId !== undefined) variant.parentVariantId = input.parentVariantId;
    const saved = await repository.save(variant);

    await recordAudit(manager, {
      actorId,
      entityType: variantAuditType,
      entityId: saved.id,
      campaignId: saved.campaignId,
      action: before.status === saved.status ? 'update' : 'status',
      before,
      after: variantSnapshot(saved),
    });
    return loadVariantDto(manager, saved.id);
  });
}

async function checkLineageParent(manager: EntityManager, campaignId: number, parentVariantId: number): Promise<void> {
  const parent = await manager.getRepository(Variant).findOne({ where: { id: parentVariantId }, select: { id: true, campaignId: true } });
  if (!parent) throw badRequest(`There is no variant with id ${parentVariantId}.`, { parentVariantId: `no variant has id ${parentVariantId}` });
  if (parent.campaignId !== campaignId) {
    const message = `variant ${parentVariantId} belongs to another campaign; lineage stays within one campaign`;
    throw badRequest(`The parent ${message}.`, { parentVariantId: message });
  }
}

async function refuseLineageCycle(manager: EntityManager, variant: Variant, parentVariantId: number): Promise<void> {
  // Walk up from the proposed parent; UNION (not UNION ALL) stops on any loop already stored.
  const [cycle]: { found: number }[] = await manager.query(
    `WITH RECURSIVE ancestry(id, parent_id) AS (
       SELECT id, parent_variant_id FROM variants WHERE id = ?
       UNION
       SELECT v.id, v.parent_variant_id FROM variants v JOIN ancestry a ON v.id = a.parent_id
     )
     SELECT 1 AS found FROM ancestry WHERE id = ? LIMIT 1`,
    [parentVariantId, variant.id],
  );
  if (cycle) {
    const message = `variant ${parentVariantId} descends from ${variant.label}; a lineage cannot loop`;
    throw badRequest(`The parent ${message}.`, { parentVariantId: message });
  }
}

interface DetailRecord extends VariantRecord {
  notes: string | null;
  created_by_id: number | null;
  created_by_name: string | null;
  campaign_name: string;
  campaign_status: Campaign['status'];
  target_substrate: string;
  target_ph: number;
  target_temperature_k: number;
}

interface AuditRecord {
  at: string;
  before: string | null;
  after: string | null;
  actor_id: number | null;
  actor_name: string | null;
}

async function loadVariantDto(manager: EntityManager, id: number): Promise<VariantDto> {
  const [record]: DetailRecord[] = await manager.query(
    `SELECT ${variantColumns}, v.notes, v.created_by_id, creator.name AS created_by_name,
            c.name AS campaign_name, c.status AS campaign_status, c.target_substrate, c.target_ph, c.target_temperature_k
       FROM variants v
       JOIN campaigns c ON c.id = v.campaign_id
       LEFT JOIN users creator ON creator.id = v.created_by_id
      WHERE v.id = ?`,
    [id],
  );
  if (!record) throw notFound('The variant');
  const [row] = await withMutations(manager, [record]);

  const parent: VariantRefDto[] =
    record.parent_variant_id === null
      ? []
      : await manager.query(`SELECT id, label, status FROM variants WHERE id = ?`, [record.parent_variant_id]);
  const children: VariantRefDto[] = await manager.query(
    `SELECT id, label, status FROM variants WHERE parent_variant_id = ? ORDER BY label, id LIMIT ${childrenShown}`,
    [id],
  );
  const [{ n: childCount }]: { n: number }[] = await manager.query(`SELECT COUNT(*) AS n FROM variants WHERE parent_variant_id = ?`, [id]);

  const positions = row.mutations.map((mutation) => mutation.position);
  const sites: { id: number; position: number; residue: string; role: CatalyticRole; expected_pka: number | null; note: string | null }[] =
    positions.length === 0
      ? []
      : await manager.query(
          `SELECT id, position, residue, role, expected_pka, note FROM catalytic_sites
            WHERE enzyme_id = ? AND position IN (${positions.map(() => '?').join(', ')})`,
          [record.enzyme_id, ...positions],
        );
  const catalyticSites: TouchedSiteDto[] = sites
    .sort((left, right) => left.position - right.position || catalyticRoles.indexOf(left.role) - catalyticRoles.indexOf(right.role))
    .map((site) => {
      const mutation = row.mutations.find((candidate) => candidate.position === site.position)!;
      return {
        id: site.id,
        position: site.position,
        residue: site.residue,
        role: site.role,
        expectedPka: site.expected_pka,
        note: site.note,
        mutation: `${mutation.from}${mutation.position}${mutation.to}`,
      };
    });

  const audit: AuditRecord[] = await manager.query(
    `SELECT a.at, a.before, a.after, a.actor_id, u.name AS actor_name
       FROM audit_events a LEFT JOIN users u ON u.id = a.actor_id
      WHERE a.entity_type = ? AND a.entity_id = ?
      ORDER BY a.at, a.id`,
    [variantAuditType, id],
  );

  const createdBy: PersonRefDto | null =
    record.created_by_id === null ? null : { id: record.created_by_id, name: record.created_by_name ?? '' };
  return {
    ...row,
    notes: record.notes,
    campaign: {
      id: record.campaign_id,
      name: record.campaign_name,
      status: record.campaign_status,
      targetSubstrate: record.target_substrate,
      targetPh: record.target_ph,
      targetTemperatureC: celsiusFromKelvin(record.target_temperature_k),
    },
    createdBy,
    lineage: { parent: parent[0] ?? null, children, childCount: Number(childCount) },
    catalyticSites,
    statusHistory: statusHistory(audit),
  };
}

// Status changes are whatever audit events show a different status after than before, so changes
// recorded by other modules (e.g. a variant marked characterized by a measurement) count too.
function statusHistory(events: readonly AuditRecord[]): VariantStatusChangeDto[] {
  const history: VariantStatusChangeDto[] = [];
  for (const event of events) {
    const before = event.before === null ? null : (JSON.parse(event.before) as { status?: VariantStatus });
    const after = event.after === null ? null : (JSON.parse(event.after) as { status?: VariantStatus });
    if (after?.status === undefined || after.status === before?.status) continue;
    history.push({
      status: after.status,
      previousStatus: before?.status ?? null,
      at: isoFromSqlite(event.at),
      actor: event.actor_id === null ? null : { id: event.actor_id, name: event.actor_name ?? '' },
    });
  }
  return history;
}

/** The audited form of a variant. */
export function variantSnapshot(variant: Variant) {
  return {
    id: variant.id,
    campaignId: variant.campaignId,
    enzymeId: variant.enzymeId,
    label: variant.label,
    hgvs: variant.hgvs,
    status: variant.status,
    constructId: variant.constructId,
    notes: variant.notes,
    parentVariantId: variant.parentVariantId,
    version: variant.version,
  };
}
