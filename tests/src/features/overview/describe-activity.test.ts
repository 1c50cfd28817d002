import { describe, expect, it } from 'vitest';
import type { OverviewActivityDto } from '@shared/schemas/overview';
import { describeActivity } from '@/features/overview/describe-activity';

// Invented events in the shape the audit trail stores (plumbing fixtures).
function event(overrides: Partial<OverviewActivityDto>): OverviewActivityDto {
  return {
    id: 1,
    at: '2026-03-04T10:00:00.000Z',
    actor: { id: 2, name: 'Pat Example' },
    entityType: 'measurement',
    entityId: 7,
    campaignId: 1,
    action: 'approve',
    before: null,
    after: null,
    variant: { id: 14, label: 'Y87E' },
    ...overrides,
  };
}

const sentence = (overrides: Partial<OverviewActivityDto>) => {
  const described = describeActivity(event(overrides));
  return `${described.actor} ${described.lead} ${described.variant?.label ?? '∅'}${described.tail}`;
};

describe('describeActivity', () => {
  it('names the review step and the variant measured', () => {
    expect(sentence({ action: 'approve' })).toBe('Pat Example approved a measurement of Y87E');
    expect(sentence({ action: 'submit' })).toBe('Pat Example submitted a measurement of Y87E for review');
    expect(sentence({ action: 'flag', after: { reviewReason: 'pH drifted' } })).toBe('Pat Example flagged a measurement of Y87E: “pH drifted”');
  });

  it('tells a status change from a registration', () => {
    expect(sentence({ entityType: 'variant', action: 'create', after: { status: 'designed' } })).toBe('Pat Example registered Y87E (designed)');
    expect(sentence({ entityType: 'variant', action: 'status', before: { status: 'cloned' }, after: { status: 'expressed' } })).toBe(
      'Pat Example moved Y87E from cloned to expressed',
    );
  });

  it('counts the rate points of an assay', () => {
    expect(sentence({ entityType: 'assay', action: 'create', after: { points: 18 } })).toBe('Pat Example entered an assay of Y87E (18 rate points)');
    expect(sentence({ entityType: 'assay', action: 'create', after: { points: 0 } })).toBe('Pat Example entered an assay of Y87E');
  });

  it('keeps an event it has no words for, in its raw terms', () => {
    expect(sentence({ entityType: 'catalytic-site', action: 'delete', variant: null, entityId: 9 })).toBe('Pat Example delete catalytic site 9 ∅');
    expect(sentence({ actor: null, entityType: 'campaign', action: 'create', variant: null })).toBe('Someone started the campaign ∅');
  });
});
