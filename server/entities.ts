import { Assay } from './modules/assays/assay.entity';
import { RatePoint } from './modules/assays/rate-point.entity';
import { Attachment } from './modules/attachments/attachment.entity';
import { AuditEvent } from './modules/audit/audit-event.entity';
import { Campaign } from './modules/campaigns/campaign.entity';
import { CatalyticSite } from './modules/enzymes/catalytic-site.entity';
import { Enzyme } from './modules/enzymes/enzyme.entity';
import { Measurement } from './modules/measurements/measurement.entity';
import { PhProfile } from './modules/ph-profiles/ph-profile.entity';
import { SessionRecord } from './modules/sessions/session.entity';
import { User } from './modules/users/user.entity';
import { Mutation } from './modules/variants/mutation.entity';
import { Variant } from './modules/variants/variant.entity';

/** Every entity the data source knows; listed explicitly so tsx and the TypeORM CLI load the same set. */
export const entities = [User, SessionRecord, Enzyme, CatalyticSite, Campaign, Variant, Mutation, Assay, RatePoint, Measurement, PhProfile, Attachment, AuditEvent];
