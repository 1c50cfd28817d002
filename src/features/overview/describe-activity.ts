import type { OverviewActivityDto } from '@shared/schemas/overview';

/**
 * One audit event as a sentence about the work: `{actor} {lead} {variant} {tail}`, where the variant (when
 * there is one) becomes a link. Unknown entity types or actions fall back to the raw words, so a new kind
 * of event still shows up rather than disappearing.
 */
export interface ActivitySentence {
  actor: string;
  lead: string;
  variant: { id: number; label: string } | null;
  tail: string;
}

const measurementWords: Record<string, [lead: string, tail: string]> = {
  create: ['added a measurement of', ''],
  submit: ['submitted a measurement of', ' for review'],
  approve: ['approved a measurement of', ''],
  flag: ['flagged a measurement of', ''],
  retract: ['retracted a measurement of', ''],
  supersede: ['replaced a measurement of', ' with a refit'],
};

const field = (snapshot: unknown, name: string): unknown =>
  typeof snapshot === 'object' && snapshot !== null && name in snapshot ? (snapshot as Record<string, unknown>)[name] : undefined;

const text = (value: unknown): string | null => (typeof value === 'string' && value !== '' ? value : null);

export function describeActivity(event: OverviewActivityDto): ActivitySentence {
  const actor = event.actor?.name ?? 'Someone';
  const variant = event.variant;
  const sentence = (lead: string, tail = ''): ActivitySentence => ({ actor, lead, variant, tail });

  switch (event.entityType) {
    case 'variant': {
      const status = text(field(event.after, 'status'));
      if (event.action === 'create') return sentence('registered', status ? ` (${status})` : '');
      if (event.action === 'status') {
        const before = text(field(event.before, 'status'));
        return sentence('moved', before && status ? ` from ${before} to ${status}` : status ? ` to ${status}` : '');
      }
      return sentence('edited');
    }
    case 'measurement': {
      const words = measurementWords[event.action];
      if (!words) break;
      const reason = event.action === 'flag' || event.action === 'retract' ? text(field(event.after, 'reviewReason')) : null;
      return sentence(words[0], reason ? `${words[1]}: “${reason}”` : words[1]);
    }
    case 'assay': {
      const points = field(event.after, 'points');
      if (event.action === 'create') return sentence('entered an assay of', typeof points === 'number' && points > 0 ? ` (${points} rate points)` : '');
      if (event.action === 'refit') return sentence('refitted an assay of');
      break;
    }
    case 'ph-profile':
      if (event.action === 'create') return sentence('fitted a pH profile of');
      break;
    case 'campaign':
      if (event.action === 'create') return { actor, lead: 'started the campaign', variant: null, tail: '' };
      if (event.action === 'update') return { actor, lead: 'changed the campaign’s settings', variant: null, tail: '' };
      break;
  }
  return { actor, lead: `${event.action} ${event.entityType.replace(/-/g, ' ')}${variant ? ' of' : ` ${event.entityId}`}`, variant, tail: '' };
}
