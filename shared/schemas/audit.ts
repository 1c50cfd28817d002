import { z } from 'zod';
import type { PersonRefDto } from './campaign';
import { queryNumberText, queryText } from './query-string';

/** Longest audit page. */
export const maxAuditPageSize = 200;

const idFilter = (what: string) =>
  z.preprocess(
    queryNumberText,
    z
      .number({ error: `must be ${what} (a whole number from 1)` })
      .int(`must be ${what} (a whole number from 1)`)
      .min(1, `must be ${what} (a whole number from 1)`)
      .max(Number.MAX_SAFE_INTEGER, `must be ${what} (a whole number from 1)`)
      .optional(),
  );

const pageSizeMessage = `must be a whole number from 1 to ${maxAuditPageSize}`;

/** Query string of `GET /api/audit`; events come newest first. */
export const listAuditQuery = z.strictObject(
  {
    entityType: z.preprocess(
      queryText,
      z
        .string({ error: 'must be text' })
        .regex(/^[a-z][a-z-]*$/, 'must be an entity type such as variant, enzyme or campaign')
        .max(32, 'must be at most 32 characters')
        .optional(),
    ),
    entityId: idFilter('an id'),
    campaignId: idFilter('a campaign id'),
    page: z.preprocess(
      queryNumberText,
      z
        .number({ error: 'must be a whole number from 1' })
        .int('must be a whole number from 1')
        .min(1, 'must be a whole number from 1')
        .max(1_000_000, 'must be at most 1000000')
        .default(1),
    ),
    pageSize: z.preprocess(
      queryNumberText,
      z.number({ error: pageSizeMessage }).int(pageSizeMessage).min(1, pageSizeMessage).max(maxAuditPageSize, pageSizeMessage).default(50),
    ),
  },
  {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `unknown parameter ${issue.keys.map((key) => `'${key}'`).join(', ')}; the audit trail takes entityType, entityId, campaignId, page and pageSize`
        : undefined,
  },
);
export type ListAuditQuery = z.infer<typeof listAuditQuery>;

/** One recorded change: who, when, what, and the row before and after it. */
export interface AuditEventDto {
  id: number;
  at: string;
  actor: PersonRefDto | null;
  entityType: string;
  entityId: number;
  campaignId: number | null;
  action: string;
  before: unknown;
  after: unknown;
}

/** `GET /api/audit`. */
export interface AuditListDto {
  rows: AuditEventDto[];
  total: number;
  page: number;
  pageSize: number;
}
