import type { DataSource, EntityManager } from 'typeorm';
import { defaultDigestSettings, type DigestSettingsDto, type UpdateDigestSettingsInput } from '@shared/schemas/digest';
import { HttpError, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { requireCampaign } from './digest-subscriptions';
import { DigestSetting } from './digest-setting.entity';

/** Audit entity type of settings changes. */
export const digestSettingsAuditType = 'digest-settings';

/**
 * A campaign's digest settings, or the defaults (version null) when its lead never changed them.
 *
 * @param manager entity manager
 * @param campaignId the campaign
 * @returns the settings
 */
export async function loadDigestSettings(manager: EntityManager, campaignId: number): Promise<DigestSettingsDto> {
  const row = await manager.getRepository(DigestSetting).findOneBy({ campaignId });
  if (!row) return { campaignId, ...defaultDigestSettings, version: null, updatedAt: null };
  return { campaignId, reviewStates: row.reviewStates, topCount: row.topCount, version: row.version, updatedAt: row.updatedAt.toISOString() };
}

/**
 * Saves a campaign's digest settings: which review states count and how many variants are listed.
 * `version` must be the stored row's (null while the defaults are in use), else 409 `stale_version`.
 * Audited with the settings before and after.
 *
 * @param dataSource the data source
 * @param actorId the lead or admin
 * @param campaignId the campaign; 404 when unknown
 * @param input the settings and version
 * @returns the saved settings
 */
export async function updateDigestSettings(dataSource: DataSource, actorId: number, campaignId: number, input: UpdateDigestSettingsInput): Promise<DigestSettingsDto> {
  return writeTransaction(dataSource, async (manager) => {
    await requireCampaign(manager, campaignId);
    const repository = manager.getRepository(DigestSetting);
    const row = await repository.findOneBy({ campaignId });
    const before = await loadDigestSettings(manager, campaignId);
    if (row && input.version !== row.version) throw staleVersion("This campaign's digest settings", row.version);
    if (!row && input.version !== null) {
      throw new HttpError(409, 'stale_version', "This campaign's digest settings changed since you loaded them. Reload and try again.", undefined, { currentVersion: null });
    }
    const saved = await repository.save(
      row ? Object.assign(row, { reviewStates: input.reviewStates, topCount: input.topCount, updatedById: actorId }) : repository.create({ campaignId, reviewStates: input.reviewStates, topCount: input.topCount, updatedById: actorId }),
    );
    const after = { campaignId, reviewStates: saved.reviewStates, topCount: saved.topCount, version: saved.version, updatedAt: saved.updatedAt.toISOString() };
    await recordAudit(manager, { actorId, entityType: digestSettingsAuditType, entityId: campaignId, campaignId, action: 'update', before, after });
    return after;
  });
}
