import { Assay } from './modules/assays/assay.entity';
import { RatePoint } from './modules/assays/rate-point.entity';
import { Attachment } from './modules/attachments/attachment.entity';
import { AuditEvent } from './modules/audit/audit-event.entity';
import { Campaign } from './modules/campaigns/campaign.entity';
import { CatalyticSite } from './modules/enzymes/catalytic-site.entity';
import { Enzyme } from './modules/enzymes/enzyme.entity';
import { ImportJob } from './modules/imports/import-job.entity';
import { SavedColumnMapping } from './modules/imports/saved-column-mapping.entity';
import { DigestRun } from './modules/digests/digest-run.entity';
import { DigestSetting } from './modules/digests/digest-setting.entity';
import { DigestSubscription } from './modules/digests/digest-subscription.entity';
import { Invitation } from './modules/invitations/invitation.entity';
import { OutboxMessage } from './modules/mail/outbox-message.entity';
import { ReceivedMessage } from './modules/mail/received-message.entity';
import { Measurement } from './modules/measurements/measurement.entity';
import { PasswordReset } from './modules/password-resets/password-reset.entity';
import { PhProfile } from './modules/ph-profiles/ph-profile.entity';
import { SessionRecord } from './modules/sessions/session.entity';
import { User } from './modules/users/user.entity';
import { Mutation } from './modules/variants/mutation.entity';
import { Variant } from './modules/variants/variant.entity';

/** Every entity the data source knows; listed explicitly so tsx and the TypeORM CLI load the same set. */
export const entities = [User, SessionRecord, Enzyme, CatalyticSite, Campaign, Variant, Mutation, Assay, RatePoint, Measurement, PhProfile, Attachment, AuditEvent, ImportJob, SavedColumnMapping, OutboxMessage, ReceivedMessage, Invitation, PasswordReset, DigestSubscription, DigestSetting, DigestRun];
