import type { EntityManager } from 'typeorm';
import { mutationKey } from '@shared/mutations/format-mutations';
import type { MutationSet } from '@shared/mutations/parse-mutations';
import type { ImportPreviewRowDto } from '@shared/schemas/import';
import { createVariantInput, type VariantStatus } from '@shared/schemas/variant';
import { sqliteFromDate } from '../../sqlite-datetime';
import type { AuditEntry } from '../audit/record-audit';
import { Mutation } from '../variants/mutation.entity';
import { Variant } from '../variants/variant.entity';
import { variantAuditType, variantSnapshot } from '../variants/variants.service';
import { ImportLookups, type CampaignInfo, type VariantInfo } from './import-lookups';
import { insertAuditEvents, insertEntities } from './insert-rows';
import type { ResolvedMapping } from './resolve-mapping';
import { issuesToProblems, RowReader } from './row-reader';
import { invalidUnit, type ImportHandler } from './run-import';
import type { SheetRow } from './read-sheets';

/** A variant written earlier in the same import, whose id is known once its chunk is written. */
interface PendingVariant {
  id: number | null;
  label: string;
  campaignId: number;
}

type LineageParent = { kind: 'stored'; variant: VariantInfo } | { kind: 'pending'; variant: PendingVariant } | null;

interface VariantFields {
  status: VariantStatus | null;
  constructId: string | null;
  notes: string | null;
}

type VariantPlan =
  | { type: 'new'; row: number; info: CampaignInfo; set: MutationSet; fields: VariantFields; parent: LineageParent; pending: PendingVariant }
  | { type: 'update'; row: number; variant: VariantInfo; changes: Partial<VariantFields> & { parent?: LineageParent } };

interface VariantUnit {
  reader: RowReader;
  campaignText: string | null;
}

const PREVIEW_COLUMNS = ['Campaign', 'Label', 'HGVS', 'Status', 'Construct id', 'Notes', 'Lineage parent'];

/** Import options every kind gets. */
export interface HandlerOptions {
  manager: EntityManager;
  lookups: ImportLookups;
  mapping: ResolvedMapping;
  /** The sheet's rows in batches, in order, as they are read. */
  rows: AsyncIterable<SheetRow[]>;
  defaultCampaignId: number | null;
  actorId: number;
}

/**
 * Variants: one row a variant, identified by campaign and mutation set (in any notation the parser takes,
 * checked against the campaign's parent sequence). A new set is registered as POST /api/variants would
 * (status designed unless given; not in a closed campaign); a registered one is updated in the mapped fields
 * only (status, construct id, notes, lineage parent), with its version raised and an audit event each, or
 * left unchanged when they already agree. A lineage parent is another variant of the same campaign,
 * registered or on an earlier row; the parent variant itself has none, and a lineage cannot loop.
 *
 * @param options manager, lookups, mapping, rows, default campaign, actor
 * @returns the handler
 */
export function variantImport(options: HandlerOptions): ImportHandler<VariantUnit, VariantPlan> {
  const { manager, lookups, mapping, actorId } = options;
  // campaign:key → the row that named the set first, and the variant it is or will be.
  const inFile = new Map<string, { row: number; pending: PendingVariant | null }>();

  return {
    previewColumns: PREVIEW_COLUMNS,

    // Rows stand alone, so each batch is checked and written as it arrives; a campaign's variants are read
    // with the first batch that names it (earlier batches wrote only to the campaigns they named).
    async *units() {
      for await (const rows of options.rows) {
        const units: VariantUnit[] = [];
        const campaignIds = new Set<number>();
        for (const row of rows) {
          const reader = new RowReader(mapping, row);
          const campaignText = reader.text('campaign');
          units.push({ reader, campaignText });
          const campaign = lookups.campaign(campaignText, options.defaultCampaignId);
          if (campaign.ok) campaignIds.add(campaign.info.campaign.id);
        }
        await lookups.loadVariants(campaignIds);
        yield units;
      }
    },

    rowCount: () => 1,

    check({ reader, campaignText }) {
      const row = reader.rowNumber;
      const campaign = lookups.campaign(campaignText, options.defaultCampaignId);
      if (!campaign.ok) reader.problem('campaign', campaign.message);
      const mutationsText = reader.text('mutations') ?? '';
      const status = reader.choice('status') as VariantStatus | null;
      const constructId = reader.text('constructId');
      const notes = reader.text('notes');
      const parentText = reader.text('parentVariant');
      if (!campaign.ok || reader.problems.length > 0) return invalidUnit([row], reader.problems);
      const info = campaign.info;

      // The API's own limits on each field.
      const checked = createVariantInput.safeParse({ campaignId: info.campaign.id, mutations: mutationsText, status: status ?? undefined, constructId, notes });
      if (!checked.success) return invalidUnit([row], issuesToProblems(checked.error.issues, (path) => fieldOfPath(path), row));

      const parsed = lookups.parse(info, mutationsText);
      if (!parsed.ok) {
        return invalidUnit([row], [{ row, field: 'mutations', message: parsed.problems.map((problem) => `${problem.token}: ${problem.message}`).join('; ') }]);
      }
      const set = parsed.value;
      const key = mutationKey(set.mutations);
      const fileKey = `${info.campaign.id}:${key}`;
      const earlier = inFile.get(fileKey);
      if (earlier) return invalidUnit([row], [{ row, field: 'mutations', message: `names the same mutation set (${set.label}) as row ${earlier.row}` }]);

      const parent = parentText === null ? null : lineageParent(info, parentText, key);
      if (parent !== null && 'message' in parent) return invalidUnit([row], [{ row, field: 'parentVariant', message: parent.message }]);
      const fields: VariantFields = { status, constructId: checked.data.constructId ?? null, notes: checked.data.notes ?? null };
      const existing = lookups.variantByKey(info.campaign.id, key);
      const preview = (outcome: ImportPreviewRowDto['outcome'], current: VariantInfo | null): ImportPreviewRowDto => ({
        row,
        outcome,
        values: {
          Campaign: info.campaign.name,
          Label: set.label,
          HGVS: set.hgvs,
          Status: status ?? current?.status ?? 'designed',
          'Construct id': reader.has('constructId') ? fields.constructId : (current?.constructId ?? null),
          Notes: reader.has('notes') ? fields.notes : (current?.notes ?? null),
          'Lineage parent': parent === null ? (reader.has('parentVariant') ? null : labelOfParent(current)) : parent.variant.label,
        },
      });

      if (existing) {
        inFile.set(fileKey, { row, pending: null });
        const problem = refuseLineageChange(existing, parent, reader.has('parentVariant'));
        if (problem !== null) return invalidUnit([row], [{ row, field: 'parentVariant', message: problem }]);
        const changes = changesOf(existing, fields, parent, reader);
        const seen: [string, number][] = [[`variant:${existing.id}`, existing.version]];
        if (Object.keys(changes).length === 0) return { rows: [row], outcome: 'unchanged', problems: [], preview: [preview('unchanged', existing)], plan: null, seen };
        return { rows: [row], outcome: 'updated', problems: [], preview: [preview('updated', existing)], plan: { type: 'update', row, variant: existing, changes }, seen };
      }
      if (set.mutations.length === 0) {
        return invalidUnit([row], [{ row, field: 'mutations', message: `campaign ${info.campaign.name} has no parent variant to match` }]);
      }
      if (info.campaign.status === 'closed') {
        return invalidUnit([row], [{ row, field: 'campaign', message: `campaign ${info.campaign.name} is closed; reopen it to register variants` }]);
      }
      const pending: PendingVariant = { id: null, label: set.label, campaignId: info.campaign.id };
      inFile.set(fileKey, { row, pending });
      return {
        rows: [row],
        outcome: 'new',
        problems: [],
        preview: [preview('new', null)],
        plan: { type: 'new', row, info, set, fields, parent, pending },
        seen: [],
      };
    },

    async write(plans) {
      const now = new Date();
      const created = plans.filter((plan): plan is Extract<VariantPlan, { type: 'new' }> => plan.type === 'new');
      // A parent on an earlier row of the same chunk gets its id only with this insert.
      const parentPending = created.map((plan) => plan.parent?.kind === 'pending' && plan.parent.variant.id === null);
      const ids = await insertEntities(
        manager,
        Variant,
        created.map((plan) => ({
          campaignId: plan.info.campaign.id,
          enzymeId: plan.info.campaign.enzymeId,
          parentVariantId: parentId(plan.parent),
          label: plan.set.label,
          hgvs: plan.set.hgvs,
          mutationKey: mutationKey(plan.set.mutations),
          mutationCount: plan.set.mutations.length,
          firstPosition: plan.set.mutations[0].position,
          constructId: plan.fields.constructId,
          status: plan.fields.status ?? 'designed',
          notes: plan.fields.notes,
          createdById: actorId,
        })),
        now,
      );
      const mutations: Partial<Mutation>[] = [];
      const lineageFixes: [number, PendingVariant][] = [];
      created.forEach((plan, index) => {
        plan.pending.id = ids[index];
        for (const mutation of plan.set.mutations) {
          mutations.push({ variantId: ids[index], position: mutation.position, fromResidue: mutation.from, toResidue: mutation.to });
        }
        if (parentPending[index] && plan.parent) lineageFixes.push([ids[index], plan.parent.variant as PendingVariant]);
      });
      await insertEntities(manager, Mutation, mutations, now);
      for (const [id, parent] of lineageFixes) await manager.query(`UPDATE variants SET parent_variant_id = ? WHERE id = ?`, [parent.id, id]);

      const events: AuditEntry[] = [];
      created.forEach((plan, index) => {
        const variant = toInfo(plan, ids[index]);
        lookups.remember(variant);
        events.push({ actorId, entityType: variantAuditType, entityId: variant.id, campaignId: variant.campaignId, action: 'create', after: snapshot(variant) });
      });
      for (const plan of plans) {
        if (plan.type !== 'update') continue;
        const before = plan.variant;
        const after: VariantInfo = {
          ...before,
          status: plan.changes.status ?? before.status,
          constructId: plan.changes.constructId !== undefined ? plan.changes.constructId : before.constructId,
          notes: plan.changes.notes !== undefined ? plan.changes.notes : before.notes,
          parentVariantId: plan.changes.parent !== undefined ? parentId(plan.changes.parent) : before.parentVariantId,
          version: before.version + 1,
        };
        const updated: unknown[] = await manager.query(
          `UPDATE variants SET status = ?, construct_id = ?, notes = ?, parent_variant_id = ?, version = version + 1, updated_at = ?
            WHERE id = ? AND version = ? RETURNING id`,
          [after.status, after.constructId, after.notes, after.parentVariantId, sqliteFromDate(now), before.id, before.version],
        );
        if (updated.length === 0) throw new Error(`variant ${before.id} changed while the import was writing`);
        lookups.remember(after);
        events.push({
          actorId,
          entityType: variantAuditType,
          entityId: before.id,
          campaignId: before.campaignId,
          action: before.status === after.status ? 'update' : 'status',
          before: snapshot(before),
          after: snapshot(after),
        });
      }
      await insertAuditEvents(manager, events);
    },

    async finish() {
      // Variants carry no derived values of their own until they are measured.
    },
  };

  function lineageParent(info: CampaignInfo, text: string, ownKey: string): LineageParent | { message: string } {
    const parsed = lookups.parse(info, text);
    if (!parsed.ok) return { message: parsed.problems.map((problem) => `${problem.token}: ${problem.message}`).join('; ') };
    const key = mutationKey(parsed.value.mutations);
    if (key === ownKey) return { message: 'cannot be the variant itself' };
    const stored = lookups.variantByKey(info.campaign.id, key);
    if (stored) return { kind: 'stored', variant: stored };
    const pending = inFile.get(`${info.campaign.id}:${key}`)?.pending;
    if (pending) return { kind: 'pending', variant: pending };
    return { message: `${parsed.value.label} is not registered in campaign ${info.campaign.name}, nor on an earlier row` };
  }

  function refuseLineageChange(existing: VariantInfo, parent: LineageParent, mapped: boolean): string | null {
    if (!mapped || parent === null) return null;
    if (existing.mutationCount === 0) return 'the campaign’s parent variant is the root of its lineage and has no parent';
    if (parent.kind !== 'stored') return null;
    // Walk up from the proposed parent through the stored lineage (all the campaign's variants are loaded).
    const visited = new Set<number>();
    let current: VariantInfo | undefined = parent.variant;
    while (current && !visited.has(current.id)) {
      if (current.id === existing.id) return `${parent.variant.label} descends from ${existing.label}; a lineage cannot loop`;
      visited.add(current.id);
      current = current.parentVariantId === null ? undefined : lookups.variantById(current.parentVariantId);
    }
    return null;
  }

  function labelOfParent(variant: VariantInfo | null): string | null {
    if (!variant || variant.parentVariantId === null) return null;
    return lookups.variantById(variant.parentVariantId)?.label ?? null;
  }
}

function fieldOfPath(path: readonly PropertyKey[]): string | null {
  const first = String(path[0] ?? '');
  if (first === 'campaignId') return 'campaign';
  return ['mutations', 'status', 'constructId', 'notes'].includes(first) ? first : null;
}

function changesOf(existing: VariantInfo, fields: VariantFields, parent: LineageParent, reader: RowReader): Partial<VariantFields> & { parent?: LineageParent } {
  const changes: Partial<VariantFields> & { parent?: LineageParent } = {};
  // A blank status keeps the stored one (a variant always has a status); blank text clears the field.
  if (reader.has('status') && fields.status !== null && fields.status !== existing.status) changes.status = fields.status;
  if (reader.has('constructId') && fields.constructId !== existing.constructId) changes.constructId = fields.constructId;
  if (reader.has('notes') && fields.notes !== existing.notes) changes.notes = fields.notes;
  if (reader.has('parentVariant')) {
    // A parent still to be written in this import is always a change.
    const same = parent === null ? existing.parentVariantId === null : parent.kind === 'stored' && parent.variant.id === existing.parentVariantId;
    if (!same) changes.parent = parent;
  }
  return changes;
}

function parentId(parent: LineageParent | undefined): number | null {
  return parent ? parent.variant.id : null;
}

function toInfo(plan: Extract<VariantPlan, { type: 'new' }>, id: number): VariantInfo {
  return {
    id,
    campaignId: plan.info.campaign.id,
    enzymeId: plan.info.campaign.enzymeId,
    label: plan.set.label,
    hgvs: plan.set.hgvs,
    mutationKey: mutationKey(plan.set.mutations),
    mutationCount: plan.set.mutations.length,
    status: plan.fields.status ?? 'designed',
    constructId: plan.fields.constructId,
    notes: plan.fields.notes,
    parentVariantId: parentId(plan.parent),
    version: 1,
  };
}

function snapshot(variant: VariantInfo): ReturnType<typeof variantSnapshot> {
  return variantSnapshot(
    Object.assign(new Variant(), {
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
    }),
  );
}
