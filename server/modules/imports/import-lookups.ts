import type { EntityManager } from 'typeorm';
import { mutationKey } from '@shared/mutations/format-mutations';
import { parseMutations, type MutationSet } from '@shared/mutations/parse-mutations';
import type { VariantStatus } from '@shared/schemas/variant';
import type { VariantContext } from '../assays/assay-conditions';
import { Campaign } from '../campaigns/campaign.entity';
import { Enzyme } from '../enzymes/enzyme.entity';
import { Variant } from '../variants/variant.entity';

/** Cofactors that are metal ions (as in the assays module): the metal salt is then a reporting item. */
const METAL_COFACTORS: readonly string[] = ['Zn2+', 'Mg2+', 'Mn2+', 'Fe2+', 'Cu2+'];

// Ids per IN (...) list, far below SQLite's parameter limit.
const ID_BATCH = 500;

/** A campaign with its parent enzyme, as rows name it. */
export interface CampaignInfo {
  campaign: Campaign;
  enzyme: Enzyme;
  metalCofactorRequired: boolean;
}

/** A registered variant, with the fields an import compares. */
export interface VariantInfo {
  id: number;
  campaignId: number;
  enzymeId: number;
  label: string;
  hgvs: string;
  mutationKey: string;
  mutationCount: number;
  status: VariantStatus;
  constructId: string | null;
  notes: string | null;
  parentVariantId: number | null;
  version: number;
}

/** A variant found for a row's text, or why none was. */
export type VariantLookup = { ok: true; variant: VariantInfo; set: MutationSet } | { ok: false; message: string };

/**
 * The campaigns, enzymes and variants rows refer to, read once per import phase (inside the commit's
 * transaction, so what the checks see is what the writes build on). Mutation texts are parsed once per
 * campaign and text: a sheet of thousands of rows names a few hundred variants.
 */
export class ImportLookups {
  private readonly campaignsById = new Map<number, CampaignInfo>();
  private readonly campaignsByName = new Map<string, CampaignInfo>();
  private readonly variantsByKey = new Map<number, Map<string, VariantInfo>>();
  private readonly variantsById = new Map<number, VariantInfo>();
  private readonly parsed = new Map<string, ReturnType<typeof parseMutations>>();
  private readonly contexts = new Map<number, VariantContext>();
  private readonly found = new Map<string, VariantLookup>();

  private constructor(readonly manager: EntityManager) {}

  /** Loads every campaign with its enzyme (a registry has tens, not thousands). */
  static async load(manager: EntityManager): Promise<ImportLookups> {
    const lookups = new ImportLookups(manager);
    const campaigns = await manager.getRepository(Campaign).find();
    const enzymes = new Map((await manager.getRepository(Enzyme).find()).map((enzyme) => [enzyme.id, enzyme]));
    for (const campaign of campaigns) {
      const enzyme = enzymes.get(campaign.enzymeId);
      if (!enzyme) continue;
      const info = { campaign, enzyme, metalCofactorRequired: enzyme.cofactors.some((cofactor) => METAL_COFACTORS.includes(cofactor)) };
      lookups.campaignsById.set(campaign.id, info);
      lookups.campaignsByName.set(campaign.name.toLowerCase(), info);
    }
    return lookups;
  }

  /** The campaign a default id names, or undefined. */
  campaignById(id: number): CampaignInfo | undefined {
    return this.campaignsById.get(id);
  }

  /**
   * The campaign a cell names, by name (any case) or id, falling back to the mapping's default campaign
   * when the cell is empty.
   */
  campaign(text: string | null, defaultId: number | null): { ok: true; info: CampaignInfo } | { ok: false; message: string } {
    if (text === null) {
      const info = defaultId === null ? undefined : this.campaignsById.get(defaultId);
      return info ? { ok: true, info } : { ok: false, message: 'is required (or choose a campaign for the whole file)' };
    }
    const info = this.campaignsByName.get(text.toLowerCase()) ?? (/^\d+$/.test(text) ? this.campaignsById.get(Number(text)) : undefined);
    return info ? { ok: true, info } : { ok: false, message: `no campaign is named ${text}` };
  }

  /** Loads the variants of the given campaigns, keyed by mutation set. */
  async loadVariants(campaignIds: Iterable<number>): Promise<void> {
    for (const campaignId of campaignIds) {
      if (this.variantsByKey.has(campaignId)) continue;
      const records: Record<string, unknown>[] = await this.manager.query(
        `SELECT id, campaign_id, enzyme_id, label, hgvs, mutation_key, mutation_count, status, construct_id, notes, parent_variant_id, version
           FROM variants WHERE campaign_id = ?`,
        [campaignId],
      );
      const byKey = new Map<string, VariantInfo>();
      for (const record of records) {
        const variant: VariantInfo = {
          id: record.id as number,
          campaignId: record.campaign_id as number,
          enzymeId: record.enzyme_id as number,
          label: record.label as string,
          hgvs: record.hgvs as string,
          mutationKey: record.mutation_key as string,
          mutationCount: record.mutation_count as number,
          status: record.status as VariantStatus,
          constructId: record.construct_id as string | null,
          notes: record.notes as string | null,
          parentVariantId: record.parent_variant_id as number | null,
          version: record.version as number,
        };
        byKey.set(variant.mutationKey, variant);
        this.variantsById.set(variant.id, variant);
      }
      this.variantsByKey.set(campaignId, byKey);
    }
  }

  /** Mutation text parsed against the campaign's parent sequence, once per campaign and text. */
  parse(info: CampaignInfo, text: string): ReturnType<typeof parseMutations> {
    const cacheKey = `${info.campaign.id}\u0000${text}`;
    let result = this.parsed.get(cacheKey);
    if (!result) {
      result = parseMutations(text, { parentSequence: info.enzyme.sequence });
      this.parsed.set(cacheKey, result);
    }
    return result;
  }

  /** The registered variant with a mutation set, or undefined. */
  variantByKey(campaignId: number, key: string): VariantInfo | undefined {
    return this.variantsByKey.get(campaignId)?.get(key);
  }

  variantById(id: number): VariantInfo | undefined {
    return this.variantsById.get(id);
  }

  /** Records a variant an import has just written, so later rows find it. */
  remember(variant: VariantInfo): void {
    this.variantsByKey.get(variant.campaignId)?.set(variant.mutationKey, variant);
    this.variantsById.set(variant.id, variant);
  }

  /**
   * The registered variant a row's text names in a campaign: the text is parsed against the parent
   * sequence (so a wrong parent residue is named), and an unregistered set is refused.
   */
  variant(info: CampaignInfo, text: string | null): VariantLookup {
    // Found once per campaign and text; a registered variant stays registered for the rest of the import.
    const cacheKey = `${info.campaign.id}\u0000${text ?? ''}`;
    const cached = this.found.get(cacheKey);
    if (cached?.ok) return cached;
    const result = this.findVariant(info, text);
    this.found.set(cacheKey, result);
    return result;
  }

  private findVariant(info: CampaignInfo, text: string | null): VariantLookup {
    const parsed = this.parse(info, text ?? '');
    if (!parsed.ok) return { ok: false, message: parsed.problems.map((problem) => `${problem.token}: ${problem.message}`).join('; ') };
    const variant = this.variantByKey(info.campaign.id, mutationKey(parsed.value.mutations));
    if (!variant) {
      return {
        ok: false,
        message: `no variant ${parsed.value.label} is registered in campaign ${info.campaign.name}; import or register it first`,
      };
    }
    return { ok: true, variant, set: parsed.value };
  }

  /** The context the measurement builders take (variant, campaign, enzyme). */
  context(variant: VariantInfo): VariantContext {
    let context = this.contexts.get(variant.id);
    if (!context) {
      const info = this.campaignsById.get(variant.campaignId)!;
      context = {
        variant: Object.assign(new Variant(), { id: variant.id, campaignId: variant.campaignId, enzymeId: variant.enzymeId, label: variant.label }),
        campaign: info.campaign,
        enzyme: info.enzyme,
        metalCofactorRequired: info.metalCofactorRequired,
      };
      this.contexts.set(variant.id, context);
    }
    return context;
  }
}

/**
 * Runs a query per batch of ids and concatenates the rows (an IN list stays far below SQLite's limit).
 *
 * @param manager the entity manager
 * @param ids the ids
 * @param sql the query with `(?)` where the list goes, e.g. `SELECT … WHERE variant_id IN (?)`
 * @returns every batch's rows
 */
export async function queryByIds<T>(manager: EntityManager, ids: readonly number[], sql: string): Promise<T[]> {
  const rows: T[] = [];
  for (let start = 0; start < ids.length; start += ID_BATCH) {
    const batch = ids.slice(start, start + ID_BATCH);
    rows.push(...((await manager.query(sql.replace('(?)', `(${batch.map(() => '?').join(', ')})`), batch)) as T[]));
  }
  return rows;
}
