import type { DataSource, EntityManager } from 'typeorm';
import {
  catalyticSiteProblem,
  type CatalyticRole,
  type CatalyticSiteDto,
  type Cofactor,
  type CreateCatalyticSiteInput,
  type CreateEnzymeInput,
  type EnzymeDto,
  type EnzymeSummaryDto,
  type FastaRecordDto,
  type UpdateEnzymeInput,
} from '@shared/schemas/enzyme';
import { aminoAcidFromOneLetter } from '@shared/sequence/amino-acids';
import { parseFasta } from '@shared/sequence/parse-fasta';
import { HttpError, badRequest, conflict, notFound, staleVersion } from '../../http/errors';
import { isoFromSqlite } from '../../sqlite-datetime';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { CatalyticSite } from './catalytic-site.entity';
import { Enzyme } from './enzyme.entity';

/** Audit entity types written by this module. */
export const enzymeAuditType = 'enzyme';
export const catalyticSiteAuditType = 'catalytic-site';

// How many variant labels a refused sequence change names per position; the count gives the rest.
const examplesPerPosition = 5;

interface EnzymeListRow {
  id: number;
  name: string;
  ec_number: string | null;
  accession: string | null;
  organism: string;
  sequence_length: number;
  cofactors: string;
  other_cofactors: string | null;
  site_count: number;
  campaign_count: number;
  version: number;
  created_at: string;
  updated_at: string;
}

/** The enzymes, by name, without their sequences. */
export async function listEnzymes(dataSource: DataSource): Promise<{ rows: EnzymeSummaryDto[]; total: number }> {
  const rows: EnzymeListRow[] = await dataSource.query(
    `SELECT e.id, e.name, e.ec_number, e.accession, e.organism, length(e.sequence) AS sequence_length, e.cofactors,
            e.other_cofactors, e.version, e.created_at, e.updated_at,
            (SELECT COUNT(*) FROM catalytic_sites s WHERE s.enzyme_id = e.id) AS site_count,
            (SELECT COUNT(*) FROM campaigns c WHERE c.enzyme_id = e.id) AS campaign_count
       FROM enzymes e
      ORDER BY e.name COLLATE NOCASE, e.id`,
  );
  return {
    rows: rows.map((row) => ({
      id: row.id,
      name: row.name,
      ecNumber: row.ec_number,
      accession: row.accession,
      organism: row.organism,
      sequenceLength: row.sequence_length,
      cofactors: JSON.parse(row.cofactors) as Cofactor[],
      otherCofactors: row.other_cofactors,
      siteCount: row.site_count,
      campaignCount: row.campaign_count,
      version: row.version,
      createdAt: isoFromSqlite(row.created_at),
      updatedAt: isoFromSqlite(row.updated_at),
    })),
    total: rows.length,
  };
}

/** One enzyme with its sequence, sites and campaigns; 404 when there is none. */
export async function getEnzyme(dataSource: DataSource, id: number): Promise<EnzymeDto> {
  return loadEnzymeDto(dataSource.manager, id);
}

/** Creates an enzyme and its sites (already checked against the sequence by the schema) in one transaction. */
export async function createEnzyme(dataSource: DataSource, actorId: number, input: CreateEnzymeInput): Promise<EnzymeDto> {
  return writeTransaction(dataSource, async (manager) => {
    await refuseTakenName(manager, input.name);
    const enzyme = await manager.getRepository(Enzyme).save(
      manager.getRepository(Enzyme).create({
        name: input.name,
        ecNumber: input.ecNumber,
        accession: input.accession,
        organism: input.organism,
        sequence: input.sequence,
        cofactors: input.cofactors,
        otherCofactors: input.otherCofactors === '' ? null : input.otherCofactors,
        createdById: actorId,
      }),
    );
    const sites = input.sites.length === 0 ? [] : await manager.getRepository(CatalyticSite).save(
      input.sites.map((site) =>
        manager.getRepository(CatalyticSite).create({
          enzymeId: enzyme.id,
          position: site.position,
          residue: site.residue,
          role: site.role,
          expectedPka: site.expectedPka ?? null,
          note: site.note ?? null,
        }),
      ),
    );
    await recordAudit(manager, {
      actorId,
      entityType: enzymeAuditType,
      entityId: enzyme.id,
      action: 'create',
      after: { ...enzymeSnapshot(enzyme), sites: sites.map(toSiteDto) },
    });
    return loadEnzymeDto(manager, enzyme.id);
  });
}

/**
 * Applies changes to an enzyme, refusing a stale version. A new sequence is refused (400, naming them)
 * when an annotated site or a registered variant's mutation would no longer match it.
 */
export async function updateEnzyme(dataSource: DataSource, actorId: number, id: number, input: UpdateEnzymeInput): Promise<EnzymeDto> {
  return writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(Enzyme);
    const enzyme = await repository.findOneBy({ id });
    if (!enzyme) throw notFound('The enzyme');
    if (enzyme.version !== input.version) throw staleVersion('This enzyme', enzyme.version);
    const before = enzymeSnapshot(enzyme);

    if (input.name !== undefined && input.name.toLowerCase() !== enzyme.name.toLowerCase()) {
      await refuseTakenName(manager, input.name);
    }
    if (input.sequence !== undefined && input.sequence !== enzyme.sequence) {
      await refuseBreakingSequence(manager, enzyme.id, input.sequence);
    }

    if (input.name !== undefined) enzyme.name = input.name;
    if (input.ecNumber !== undefined) enzyme.ecNumber = input.ecNumber;
    if (input.accession !== undefined) enzyme.accession = input.accession;
    if (input.organism !== undefined) enzyme.organism = input.organism;
    if (input.sequence !== undefined) enzyme.sequence = input.sequence;
    if (input.cofactors !== undefined) enzyme.cofactors = input.cofactors;
    if (input.otherCofactors !== undefined) enzyme.otherCofactors = input.otherCofactors === '' ? null : input.otherCofactors;
    const saved = await repository.save(enzyme);

    await recordAudit(manager, {
      actorId,
      entityType: enzymeAuditType,
      entityId: saved.id,
      action: 'update',
      before,
      after: enzymeSnapshot(saved),
    });
    return loadEnzymeDto(manager, saved.id);
  });
}

/** The enzyme's annotated sites by position; 404 when the enzyme does not exist. */
export async function listSites(dataSource: DataSource, enzymeId: number): Promise<{ rows: CatalyticSiteDto[]; total: number }> {
  if (!(await dataSource.getRepository(Enzyme).existsBy({ id: enzymeId }))) throw notFound('The enzyme');
  const sites = await dataSource.getRepository(CatalyticSite).find({ where: { enzymeId }, order: { position: 'ASC', role: 'ASC' } });
  return { rows: sites.map(toSiteDto), total: sites.length };
}

/** Annotates a residue; it must be the residue the sequence has there, and (position, role) must be new. */
export async function addSite(dataSource: DataSource, actorId: number, enzymeId: number, input: CreateCatalyticSiteInput): Promise<CatalyticSiteDto> {
  return writeTransaction(dataSource, async (manager) => {
    const enzyme = await manager.getRepository(Enzyme).findOneBy({ id: enzymeId });
    if (!enzyme) throw notFound('The enzyme');
    const problem = catalyticSiteProblem(input, enzyme.sequence);
    if (problem !== undefined) throw badRequest(`The site does not match the sequence: ${problem.message}.`, { [problem.field]: problem.message });

    const repository = manager.getRepository(CatalyticSite);
    const existing = await repository.findOneBy({ enzymeId, position: input.position, role: input.role });
    if (existing) {
      throw conflict(`Position ${input.position} is already annotated as ${input.role} (site ${existing.id}).`, { existingSiteId: existing.id });
    }
    const site = await repository.save(
      repository.create({
        enzymeId,
        position: input.position,
        residue: input.residue,
        role: input.role,
        expectedPka: input.expectedPka ?? null,
        note: input.note ?? null,
      }),
    );
    await recordAudit(manager, { actorId, entityType: catalyticSiteAuditType, entityId: site.id, action: 'create', after: toSiteDto(site) });
    return toSiteDto(site);
  });
}

/** Removes an annotation; 404 when the enzyme has no such site. */
export async function deleteSite(dataSource: DataSource, actorId: number, enzymeId: number, siteId: number): Promise<void> {
  await writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(CatalyticSite);
    const site = await repository.findOneBy({ id: siteId, enzymeId });
    if (!site) throw notFound('The catalytic site');
    await repository.delete({ id: site.id });
    await recordAudit(manager, { actorId, entityType: catalyticSiteAuditType, entityId: site.id, action: 'delete', before: toSiteDto(site) });
  });
}

/**
 * Reads uploaded FASTA bytes: they must be UTF-8 (or ASCII) text, then every record is parsed and
 * returned so the client can pick one. `field` names the form field in error messages.
 */
export function readFastaUpload(bytes: Uint8Array, field: string): FastaRecordDto[] {
  if (bytes.includes(0)) throw badRequest('The file is not a text file.', { [field]: 'is not a text file (FASTA is plain text)' });
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw badRequest('The file is not UTF-8 text.', { [field]: 'is not UTF-8 text (FASTA is plain text)' });
  }
  return readFastaText(text, field);
}

/** Parses FASTA text into its records, or answers 400 naming the first problem. */
export function readFastaText(text: string, field: string): FastaRecordDto[] {
  const parsed = parseFasta(text);
  if (!parsed.ok) throw badRequest(`The FASTA text could not be read: ${parsed.message}.`, { [field]: parsed.message });
  return parsed.records.map((record) => ({
    header: record.header,
    id: record.id,
    description: record.description,
    sequence: record.sequence,
    length: record.sequence.length,
  }));
}

async function refuseTakenName(manager: EntityManager, name: string): Promise<void> {
  const [taken]: { id: number; name: string }[] = await manager.query(`SELECT id, name FROM enzymes WHERE lower(name) = lower(?) LIMIT 1`, [name]);
  if (taken) throw conflict(`An enzyme named ${taken.name} already exists.`, { existingEnzymeId: taken.id });
}

interface MutatedPositionRow {
  position: number;
  from_residue: string;
  variant_count: number;
}

async function refuseBreakingSequence(manager: EntityManager, enzymeId: number, sequence: string): Promise<void> {
  const problems: string[] = [];
  const siteConflicts: { id: number; position: number; residue: string; role: CatalyticRole; message: string }[] = [];
  const sites = await manager.getRepository(CatalyticSite).find({ where: { enzymeId }, order: { position: 'ASC', role: 'ASC' } });
  for (const site of sites) {
    const problem = catalyticSiteProblem(site, sequence);
    if (problem === undefined) continue;
    const message = problem.message.replace('of the sequence', 'of the new sequence').replace('beyond the sequence', 'beyond the new sequence');
    siteConflicts.push({ id: site.id, position: site.position, residue: site.residue, role: site.role, message });
    problems.push(`catalytic site ${residueName(site.residue)}${site.position} (${site.role}): ${message}`);
  }

  // Every stored parent residue of a position is the same letter (all were checked against the old
  // sequence), so one row per position and letter is enough to find what the new sequence breaks.
  const positions: MutatedPositionRow[] = await manager.query(
    `SELECT m.position, m.from_residue, COUNT(*) AS variant_count
       FROM mutations m JOIN variants v ON v.id = m.variant_id
      WHERE v.enzyme_id = ?
      GROUP BY m.position, m.from_residue
      ORDER BY m.position`,
    [enzymeId],
  );
  const broken = positions
    .map((row) => ({ ...row, message: mutationProblem(row.position, row.from_residue, sequence) }))
    .filter((row): row is MutatedPositionRow & { message: string } => row.message !== undefined);
  const examples = new Map<number, string[]>();
  if (broken.length > 0) {
    const rows: { position: number; label: string }[] = await manager.query(
      `SELECT position, label FROM (
         SELECT m.position AS position, v.label AS label, ROW_NUMBER() OVER (PARTITION BY m.position ORDER BY v.label) AS n
           FROM mutations m JOIN variants v ON v.id = m.variant_id
          WHERE v.enzyme_id = ? AND m.position IN (${broken.map(() => '?').join(', ')})
       ) WHERE n <= ${examplesPerPosition}`,
      [enzymeId, ...broken.map((row) => row.position)],
    );
    for (const row of rows) examples.set(row.position, [...(examples.get(row.position) ?? []), row.label]);
  }
  const mutationConflicts = broken.map((row) => ({
    position: row.position,
    from: row.from_residue,
    variantCount: row.variant_count,
    examples: examples.get(row.position) ?? [],
    message: row.message,
  }));
  for (const entry of mutationConflicts) {
    const more = entry.variantCount > entry.examples.length ? ` and ${entry.variantCount - entry.examples.length} more` : '';
    const noun = entry.variantCount === 1 ? 'variant' : 'variants';
    problems.push(`${entry.variantCount} ${noun} (${entry.examples.join(', ')}${more}): ${entry.message}`);
  }

  if (problems.length === 0) return;
  const summary = problems.join('; ');
  throw new HttpError(
    400,
    'validation_error',
    `The new sequence would no longer match what refers to it: ${summary}. Change or remove those first, or correct the sequence.`,
    { sequence: `would no longer match ${summary}` },
    { sequenceConflicts: { sites: siteConflicts, mutations: mutationConflicts } },
  );
}

function mutationProblem(position: number, fromResidue: string, sequence: string): string | undefined {
  if (position > sequence.length) return `position ${position} is beyond the new sequence (${sequence.length} residues)`;
  const residue = sequence[position - 1];
  if (residue === fromResidue) return undefined;
  return `position ${position} of the new sequence is ${residueName(residue)}, not ${residueName(fromResidue)}`;
}

function residueName(oneLetter: string): string {
  return aminoAcidFromOneLetter(oneLetter)?.threeLetter ?? `'${oneLetter}'`;
}

async function loadEnzymeDto(manager: EntityManager, id: number): Promise<EnzymeDto> {
  const enzyme = await manager.getRepository(Enzyme).findOneBy({ id });
  if (!enzyme) throw notFound('The enzyme');
  const sites = await manager.getRepository(CatalyticSite).find({ where: { enzymeId: id }, order: { position: 'ASC', role: 'ASC' } });
  const campaigns: { id: number; name: string }[] = await manager.query(
    `SELECT id, name FROM campaigns WHERE enzyme_id = ? ORDER BY name COLLATE NOCASE, id`,
    [id],
  );
  return {
    id: enzyme.id,
    name: enzyme.name,
    ecNumber: enzyme.ecNumber,
    accession: enzyme.accession,
    organism: enzyme.organism,
    sequenceLength: enzyme.sequence.length,
    sequence: enzyme.sequence,
    cofactors: enzyme.cofactors,
    otherCofactors: enzyme.otherCofactors,
    siteCount: sites.length,
    campaignCount: campaigns.length,
    sites: sites.map(toSiteDto),
    campaigns: campaigns.map((campaign) => ({ id: campaign.id, name: campaign.name })),
    version: enzyme.version,
    createdAt: enzyme.createdAt.toISOString(),
    updatedAt: enzyme.updatedAt.toISOString(),
  };
}

function toSiteDto(site: CatalyticSite): CatalyticSiteDto {
  return {
    id: site.id,
    enzymeId: site.enzymeId,
    position: site.position,
    residue: site.residue,
    role: site.role,
    expectedPka: site.expectedPka,
    note: site.note,
  };
}

function enzymeSnapshot(enzyme: Enzyme) {
  return {
    id: enzyme.id,
    name: enzyme.name,
    ecNumber: enzyme.ecNumber,
    accession: enzyme.accession,
    organism: enzyme.organism,
    sequence: enzyme.sequence,
    cofactors: enzyme.cofactors,
    otherCofactors: enzyme.otherCofactors,
    version: enzyme.version,
  };
}
