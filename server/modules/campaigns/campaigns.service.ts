import type { DataSource, EntityManager } from 'typeorm';
import { mutationKey } from '@shared/mutations/format-mutations';
import type { CampaignDto, CampaignStatus, CreateCampaignInput, PersonRefDto, UpdateCampaignInput } from '@shared/schemas/campaign';
import { variantStatuses, type VariantStatus } from '@shared/schemas/variant';
import { badRequest, conflict, notFound, staleVersion } from '../../http/errors';
import { isoFromSqlite } from '../../sqlite-datetime';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { Enzyme } from '../enzymes/enzyme.entity';
import { User } from '../users/user.entity';
import { insertParentVariant } from '../variants/variants.service';
import { Campaign } from './campaign.entity';
import { celsiusFromKelvin, kelvinFromCelsius } from './campaign-temperature';

/** Audit entity type written by this module. */
export const campaignAuditType = 'campaign';

// Roles that may lead a campaign (they hold campaigns:manage).
const leadRoles: readonly string[] = ['lead', 'admin'];

interface CampaignRecord {
  id: number;
  name: string;
  objective: string;
  enzyme_id: number;
  enzyme_name: string;
  target_substrate: string;
  target_ph: number;
  target_temperature_k: number;
  lead_id: number | null;
  lead_name: string | null;
  status: CampaignStatus;
  parent_variant_id: number | null;
  version: number;
  created_at: string;
  updated_at: string;
}

// The parent variant is found by its uniqueness key, on the (campaign_id, mutation_key) index. The key is
// a fixed word of the shared formatter, never user text, so it can sit in the SQL.
const parentKey = mutationKey([]);

const campaignSelect = `SELECT c.id, c.name, c.objective, c.enzyme_id, e.name AS enzyme_name, c.target_substrate, c.target_ph,
       c.target_temperature_k, c.lead_id, u.name AS lead_name, c.status, c.version, c.created_at, c.updated_at,
       (SELECT p.id FROM variants p WHERE p.campaign_id = c.id AND p.mutation_key = '${parentKey}') AS parent_variant_id
  FROM campaigns c
  JOIN enzymes e ON e.id = c.enzyme_id
  LEFT JOIN users u ON u.id = c.lead_id`;

/** Every campaign by name, each with its variant counts by status. */
export async function listCampaigns(dataSource: DataSource): Promise<{ rows: CampaignDto[]; total: number }> {
  const records: CampaignRecord[] = await dataSource.query(`${campaignSelect} ORDER BY c.name COLLATE NOCASE, c.id`);
  const counts = await variantCounts(dataSource.manager);
  const rows = records.map((record) => toCampaignDto(record, counts.get(record.id)));
  return { rows, total: rows.length };
}

/**
 * The people who may lead a campaign (active users with the lead or admin role), by name, so the
 * campaign form can offer them without the user administration list.
 */
export async function listLeadCandidates(dataSource: DataSource): Promise<{ rows: PersonRefDto[] }> {
  const rows: PersonRefDto[] = await dataSource.query(
    `SELECT id, name FROM users WHERE active = 1 AND role IN (${leadRoles.map(() => '?').join(', ')}) ORDER BY name COLLATE NOCASE, id`,
    [...leadRoles],
  );
  return { rows: rows.map((row) => ({ id: row.id, name: row.name })) };
}

/** One campaign with its variant counts; 404 when there is none. */
export async function getCampaign(dataSource: DataSource, id: number): Promise<CampaignDto> {
  return loadCampaignDto(dataSource.manager, id);
}

/**
 * Creates a campaign and its parent variant (the empty mutation set) in one transaction, with an
 * audit event for each. Without `leadId` the creator leads the campaign.
 */
export async function createCampaign(dataSource: DataSource, actorId: number, input: CreateCampaignInput): Promise<CampaignDto> {
  return writeTransaction(dataSource, async (manager) => {
    if (!(await manager.getRepository(Enzyme).existsBy({ id: input.enzymeId }))) {
      throw badRequest(`There is no enzyme with id ${input.enzymeId}.`, { enzymeId: `no enzyme has id ${input.enzymeId}` });
    }
    await refuseTakenName(manager, input.name);
    const leadId = input.leadId === undefined ? actorId : input.leadId;
    if (leadId !== null) await checkLead(manager, leadId);

    const repository = manager.getRepository(Campaign);
    const campaign = await repository.save(
      repository.create({
        name: input.name,
        objective: input.objective,
        enzymeId: input.enzymeId,
        targetSubstrate: input.targetSubstrate,
        targetPh: input.targetPh,
        targetTemperatureK: kelvinFromCelsius(input.targetTemperatureC),
        leadId,
        status: input.status,
      }),
    );
    await recordAudit(manager, {
      actorId,
      entityType: campaignAuditType,
      entityId: campaign.id,
      campaignId: campaign.id,
      action: 'create',
      after: campaignSnapshot(campaign),
    });
    await insertParentVariant(manager, actorId, campaign);
    return loadCampaignDto(manager, campaign.id);
  });
}

/** Applies changes to a campaign's settings, refusing a stale version. */
export async function updateCampaign(dataSource: DataSource, actorId: number, id: number, input: UpdateCampaignInput): Promise<CampaignDto> {
  return writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(Campaign);
    const campaign = await repository.findOneBy({ id });
    if (!campaign) throw notFound('The campaign');
    if (campaign.version !== input.version) throw staleVersion('This campaign', campaign.version);
    const before = campaignSnapshot(campaign);

    if (input.name !== undefined && input.name.toLowerCase() !== campaign.name.toLowerCase()) await refuseTakenName(manager, input.name);
    if (input.leadId !== undefined && input.leadId !== null && input.leadId !== campaign.leadId) await checkLead(manager, input.leadId);

    if (input.name !== undefined) campaign.name = input.name;
    if (input.objective !== undefined) campaign.objective = input.objective;
    if (input.targetSubstrate !== undefined) campaign.targetSubstrate = input.targetSubstrate;
    if (input.targetPh !== undefined) campaign.targetPh = input.targetPh;
    if (input.targetTemperatureC !== undefined) campaign.targetTemperatureK = kelvinFromCelsius(input.targetTemperatureC);
    if (input.leadId !== undefined) campaign.leadId = input.leadId;
    if (input.status !== undefined) campaign.status = input.status;
    const saved = await repository.save(campaign);

    await recordAudit(manager, {
      actorId,
      entityType: campaignAuditType,
      entityId: saved.id,
      campaignId: saved.id,
      action: 'update',
      before,
      after: campaignSnapshot(saved),
    });
    return loadCampaignDto(manager, saved.id);
  });
}

async function checkLead(manager: EntityManager, leadId: number): Promise<void> {
  const user = await manager.getRepository(User).findOneBy({ id: leadId });
  if (!user) throw badRequest(`There is no user with id ${leadId}.`, { leadId: `no user has id ${leadId}` });
  if (!user.active) throw badRequest(`${user.name} is deactivated and cannot lead a campaign.`, { leadId: `${user.name} is deactivated` });
  if (!leadRoles.includes(user.role)) {
    const message = `${user.name} is a ${user.role}; a campaign lead must have the lead or admin role`;
    throw badRequest(`${message}.`, { leadId: message });
  }
}

async function refuseTakenName(manager: EntityManager, name: string): Promise<void> {
  const [taken]: { id: number; name: string }[] = await manager.query(`SELECT id, name FROM campaigns WHERE lower(name) = lower(?) LIMIT 1`, [name]);
  if (taken) throw conflict(`A campaign named ${taken.name} already exists.`, { existingCampaignId: taken.id });
}

async function variantCounts(manager: EntityManager, campaignId?: number): Promise<Map<number, Map<VariantStatus, number>>> {
  const rows: { campaign_id: number; status: VariantStatus; n: number }[] = await manager.query(
    `SELECT campaign_id, status, COUNT(*) AS n FROM variants ${campaignId === undefined ? '' : 'WHERE campaign_id = ?'} GROUP BY campaign_id, status`,
    campaignId === undefined ? [] : [campaignId],
  );
  const counts = new Map<number, Map<VariantStatus, number>>();
  for (const row of rows) {
    const byStatus = counts.get(row.campaign_id) ?? new Map<VariantStatus, number>();
    byStatus.set(row.status, row.n);
    counts.set(row.campaign_id, byStatus);
  }
  return counts;
}

async function loadCampaignDto(manager: EntityManager, id: number): Promise<CampaignDto> {
  const [record]: CampaignRecord[] = await manager.query(`${campaignSelect} WHERE c.id = ?`, [id]);
  if (!record) throw notFound('The campaign');
  const counts = await variantCounts(manager, id);
  return toCampaignDto(record, counts.get(id));
}

function toCampaignDto(record: CampaignRecord, counts: Map<VariantStatus, number> | undefined): CampaignDto {
  const variantCountsByStatus = Object.fromEntries(variantStatuses.map((status) => [status, counts?.get(status) ?? 0])) as Record<VariantStatus, number>;
  return {
    id: record.id,
    name: record.name,
    objective: record.objective,
    enzymeId: record.enzyme_id,
    enzyme: { id: record.enzyme_id, name: record.enzyme_name },
    targetSubstrate: record.target_substrate,
    targetPh: record.target_ph,
    targetTemperatureC: celsiusFromKelvin(record.target_temperature_k),
    leadId: record.lead_id,
    lead: record.lead_id === null ? null : { id: record.lead_id, name: record.lead_name ?? '' },
    status: record.status,
    parentVariantId: record.parent_variant_id,
    variantCounts: variantCountsByStatus,
    variantTotal: Object.values(variantCountsByStatus).reduce((sum, count) => sum + count, 0),
    version: record.version,
    createdAt: isoFromSqlite(record.created_at),
    updatedAt: isoFromSqlite(record.updated_at),
  };
}

function campaignSnapshot(campaign: Campaign) {
  return {
    id: campaign.id,
    name: campaign.name,
    objective: campaign.objective,
    enzymeId: campaign.enzymeId,
    targetSubstrate: campaign.targetSubstrate,
    targetPh: campaign.targetPh,
    targetTemperatureK: campaign.targetTemperatureK,
    leadId: campaign.leadId,
    status: campaign.status,
    version: campaign.version,
  };
}
